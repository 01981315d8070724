import { config } from 'zod/v4/core';

// Zod's fast path compiles parsers with `new Function`; under our CSP (no 'unsafe-eval') even its
// caught probe for eval support is reported as a violation on every page that parses a schema.
// The interpreted path gives the same results. Imported first by main.tsx, before any schema runs.
config({ jitless: true });
