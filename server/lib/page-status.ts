import type { Request, RequestHandler } from 'express';
import { AppError } from './app-error';

/**
 * A page in front of the client that answers 404 when `load` finds nothing the reader may see there; the
 * client still draws its own not-found page, the status just tells browsers and crawlers the truth. What
 * `load` found is left in `res.locals.pageView` for the page's head (title, description, preview).
 */
export function pageFound(load: (req: Request) => unknown): RequestHandler {
  return (req, res, next) => {
    try {
      res.locals.pageView = load(req);
    } catch (err) {
      if (!(err instanceof AppError && err.status === 404)) return next(err);
      res.locals.pageStatus = 404;
    }
    next();
  };
}
