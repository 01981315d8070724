import type { RequestHandler } from 'express';
import onHeaders from 'on-headers';

/** A shared cache (a proxy, a CDN) may store any answer that does not say `private` or `no-store`. */
export const sharedCacheMayStore = (cacheControl: unknown) =>
  !/(^|[\s,])(private|no-store)([\s,=]|$)/i.test(String(cacheControl ?? ''));

/**
 * Answers a shared cache may store go to everyone, so they must never carry a session cookie: a cache
 * would hand one member's session to the next reader. Registered before the session middleware, this
 * runs after it has set its cookie (on-headers calls the earliest listener last) and takes the cookie
 * off any such answer. Routes whose answers depend on the reader say `private` (the API's default).
 */
export const noCookieOnSharedAnswers: RequestHandler = (_req, res, next) => {
  onHeaders(res, function () {
    if (this.hasHeader('Set-Cookie') && sharedCacheMayStore(this.getHeader('Cache-Control'))) this.removeHeader('Set-Cookie');
  });
  next();
};

/** The Cache-Control a route gets unless it sets its own. */
export const defaultCacheControl =
  (value: string): RequestHandler =>
  (_req, res, next) => {
    res.setHeader('Cache-Control', value);
    next();
  };
