import type { Request, Response, NextFunction, RequestHandler } from 'express';
import type { z } from 'zod';
import { retryWhileBusy } from '../db/busy';

type Schemas = { params?: z.ZodType; query?: z.ZodType; body?: z.ZodType };
type Parsed<S extends Schemas> = {
  [K in keyof S]: S[K] extends z.ZodType ? z.infer<S[K]> : never;
};

/**
 * Parses params, query and body with the given zod schemas and hands the parsed values
 * to the handler, so it never re-reads the raw request. A failure becomes a 400 with fields.
 * While another process holds the database, the handler runs again after short pauses that let
 * other requests through (`retryWhileBusy`, up to DB_BUSY_WAIT_MS), as long as it has not answered yet.
 */
export function validated<S extends Schemas>(
  schemas: S,
  handler: (input: Parsed<S>, req: Request, res: Response, next: NextFunction) => unknown,
): RequestHandler {
  return async (req, res, next) => {
    const input = {} as Record<string, unknown>;
    for (const key of ['params', 'query', 'body'] as const) {
      const schema = schemas[key];
      if (!schema) continue;
      // a missing JSON body arrives as undefined; treat it as an empty object so the schema can say what is missing
      const raw = key === 'body' && req.body === undefined ? {} : req[key];
      input[key] = schema.parse(raw);
    }
    const waitMs = (req.app.locals.dbBusyWaitMs as number | undefined) ?? 0;
    await retryWhileBusy(
      () => handler(input as Parsed<S>, req, res, next),
      waitMs,
      () => !res.headersSent,
    );
  };
}
