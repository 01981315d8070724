import { Router, type Request, type RequestHandler, type Response } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { getSwapSheet, hasPublicRevision, recentSwaps, sheetFingerprint } from './swaps.service';
import { fingerprintCache, sendCachedJson } from '../../lib/cached-json';
import { AppError } from '../../lib/app-error';
import { slugSchema } from '../../../shared/schemas/params';
import { pageRoutes } from '../../../shared/page-routes';
import { findSwapAddress } from './swap-slugs';
import { untilDbChanges } from '../../db/change-stamp';
import { SHARED_ANSWER } from '../../lib/cache-policy';

export function swapsRouter({ db }: AppDeps) {
  const router = Router();

  router.get(
    '/swaps',
    validated({ query: z.object({ limit: z.coerce.number().int().min(1).max(50).default(12) }) }, ({ query }, _req, res) => {
      res.set('Cache-Control', SHARED_ANSWER).json({ items: recentSwaps(db, query.limit) });
    }),
  );

  // sheets are read far more than they change: each is built once per change and served pre-compressed
  const sheets = fingerprintCache();
  // and while nothing at all has been written, not even the fingerprint needs reading again
  const fingerprintOf = untilDbChanges(db, (slug) => sheetFingerprint(db, slug));
  const sendSheet = (req: Request, res: Response, slug: string, n?: number) => {
    const fingerprint = fingerprintOf(slug);
    if (!fingerprint) {
      // an address the swap had before its title changed
      const moved = findSwapAddress(db, slug);
      if (moved?.moved)
        return res
          .set('Cache-Control', SHARED_ANSWER)
          .redirect(301, `/api/swaps/${moved.slug}${n === undefined ? '' : `/revisions/${n}`}`);
      throw AppError.notFound('That swap');
    }
    sendCachedJson(
      req,
      res,
      sheets(n === undefined ? slug : `${slug}/r/${n}`, fingerprint, () => getSwapSheet(db, slug, n)),
      SHARED_ANSWER,
    );
  };

  router.get(
    '/swaps/:slug',
    validated({ params: z.object({ slug: slugSchema }) }, ({ params }, req, res) => {
      sendSheet(req, res, params.slug);
    }),
  );

  router.get(
    '/swaps/:slug/revisions/:n',
    validated(
      { params: z.object({ slug: slugSchema, n: z.coerce.number().int().min(1).max(100000) }) },
      ({ params }, req, res) => {
        sendSheet(req, res, params.slug, params.n);
      },
    ),
  );

  return router;
}

/**
 * The swap pages in front of the client: an old address (before a title change) is redirected to the
 * current one, query included (a shop link's `?via=`), and a swap or revision nobody can read answers 404.
 */
export function swapPagesRouter({ db }: AppDeps) {
  const router = Router();
  const page =
    (revisionOf?: (req: Request) => string | undefined): RequestHandler =>
    (req, res, next) => {
      const address = findSwapAddress(db, String(req.params.slug));
      const n = revisionOf?.(req);
      if (!address || (n !== undefined && !hasPublicRevision(db, address.id, n))) {
        res.locals.pageStatus = 404;
        return next();
      }
      if (!address.moved) return next();
      const url = new URL(req.originalUrl, 'http://swapyard.invalid');
      url.pathname = url.pathname.replace(/^\/swaps\/[^/]+/, `/swaps/${encodeURIComponent(address.slug)}`);
      res.redirect(301, url.pathname + url.search);
    };
  router.get(pageRoutes.swap, page());
  router.get(
    pageRoutes.swapRevision,
    page((req) => String(req.params.n)),
  );
  router.get(pageRoutes.swapCompare, page());
  return router;
}
