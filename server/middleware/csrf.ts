import type { Request, RequestHandler } from 'express';
import { csrfSync } from 'csrf-sync';
import { AppError } from '../lib/app-error';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

const { generateToken, isRequestValid, revokeToken } = csrfSync({
  size: 32,
  getTokenFromRequest: (req) => {
    const header = req.headers['x-csrf-token'];
    return typeof header === 'string' ? header : undefined;
  },
  getTokenFromState: (req) => req.session?.csrfToken,
});

/** The session's synchroniser token (made on first ask); `/api/me` hands it to a signed-in client. */
export const csrfTokenFor = (req: Request): string => generateToken(req);

/** A new session (sign-in) gets a new token: the one seen before sign-in is dropped. */
export const dropCsrfToken = (req: Request) => revokeToken(req);

/**
 * Every state-changing request made as a signed-in member carries the session's token in `x-csrf-token`.
 * A request without a signed-in session acts as nobody, so there is nothing to forge: it goes on to
 * the route's own sign-in check (a 401). Anonymous visitors get no session, hence no token.
 */
export const requireCsrfToken: RequestHandler = (req, _res, next) => {
  if (safeMethods.has(req.method) || !req.user) return next();
  if (req.session && isRequestValid(req)) return next();
  req.log?.warn(
    { event: 'csrf_refused', userId: req.user?.id ?? null, method: req.method, path: req.originalUrl },
    'csrf token missing or wrong',
  );
  next(
    new AppError(
      'csrf',
      'This request is missing its security token, or the token belongs to an older session. Reload the page and try again.',
      403,
    ),
  );
};

/** Browsers say where a request came from; a state change started by another site is refused outright. */
export const refuseCrossSite: RequestHandler = (req, _res, next) => {
  if (safeMethods.has(req.method) || req.get('sec-fetch-site') !== 'cross-site') return next();
  req.log?.warn({ event: 'cross_site_refused', method: req.method, path: req.originalUrl }, 'cross-site request refused');
  next(new AppError('cross_site', 'Changes can only be made from Swapyard’s own pages.', 403));
};
