import { expect } from 'vitest';

type Answer = { status: number; headers: Record<string, string | string[] | undefined> };

/** Cache-Control split into its directives: `{ public: true, 's-maxage': 60, … }`. */
export function cacheDirectives(header: unknown): Record<string, number | true> {
  const out: Record<string, number | true> = {};
  for (const part of String(header ?? '').split(',')) {
    const [name, value] = part.trim().toLowerCase().split('=');
    if (name) out[name] = value === undefined ? true : Number(value);
  }
  return out;
}

/**
 * What a CDN in front needs from an answer that is the same for every reader: `public`, its own
 * lifetime (`s-maxage`) and a window to serve it stale while refreshing, a strong ETag, and no cookie.
 * Browsers revalidate (`max-age=0`), so a reader never sees a copy older than the origin's.
 */
export function expectSharedAnswer(res: Answer, label = '') {
  const d = cacheDirectives(res.headers['cache-control']);
  expect(res.status, label).toBe(200);
  expect(d.public, `${label} public`).toBe(true);
  expect(d.private, `${label} not private`).toBeUndefined();
  expect(d['no-store'], `${label} storable`).toBeUndefined();
  expect(d['max-age'], `${label} browsers revalidate`).toBe(0);
  expect(d['s-maxage'], `${label} s-maxage`).toBeGreaterThan(0);
  expect(d['stale-while-revalidate'], `${label} stale-while-revalidate`).toBeGreaterThan(0);
  expect(res.headers.etag, `${label} strong ETag`).toMatch(/^"[^"]+"$/);
  expect(res.headers['set-cookie'], `${label} no cookie`).toBeUndefined();
}

/** An answer at an address that never holds anything else: kept a year. */
export function expectYearLong(res: Answer, label = '') {
  const d = cacheDirectives(res.headers['cache-control']);
  expect(d.public, `${label} public`).toBe(true);
  expect(d['max-age'], `${label} max-age`).toBe(31536000);
  expect(d.immutable, `${label} immutable`).toBe(true);
  expect(res.headers['set-cookie'], `${label} no cookie`).toBeUndefined();
}
