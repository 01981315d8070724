import type { Request, RequestHandler, Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import { AppError } from '../lib/app-error';

type LimitOptions = {
  limit: number;
  windowMs: number;
  /** what is limited, for the log line and the message: "flags", "photo uploads" */
  what: string;
  /** the message the visitor reads; a generic one naming `what` by default */
  message?: string;
  /** count only answers of 400 and above (misses), so ordinary use is never held back */
  countOnlyFailures?: boolean;
  /** may answer a refusal itself (an HTML page on a page route) and return true; otherwise the JSON error goes out */
  respond?: (req: Request, res: Response, message: string) => boolean;
};

const windowWords = (ms: number) => (ms >= 3_600_000 ? 'the last hour' : `the last ${Math.round(ms / 60_000)} minutes`);

function limiter(o: LimitOptions, keyGenerator?: (req: Request) => string): RequestHandler {
  const message =
    o.message ?? `Too many ${o.what} in ${windowWords(o.windowMs)}. Wait a while and try again; nothing saved was lost.`;
  return rateLimit({
    windowMs: o.windowMs,
    limit: o.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: o.countOnlyFailures ?? false,
    ...(keyGenerator ? { keyGenerator } : {}),
    handler: (req, res, next) => {
      req.log?.warn(
        { event: 'rate_limited', userId: req.user?.id ?? null, path: req.originalUrl },
        `${o.what} rate limit reached`,
      );
      if (o.respond?.(req, res, message)) return;
      next(new AppError('rate_limited', message, 429));
    },
  });
}

/** Per signed-in member (put it after the role check, which guarantees one). */
export const perUserLimit = (o: LimitOptions) => limiter(o, (req) => `user:${req.user!.id}`);

/** Per client address, for routes anyone may call. */
export const perAddressLimit = (o: LimitOptions) => limiter(o);
