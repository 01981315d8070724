import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { getSwapSheet, recentSwaps, sheetFingerprint } from './swaps.service';
import { fingerprintCache, sendCachedJson } from '../../lib/cached-json';
import { AppError } from '../../lib/app-error';
import { slugSchema } from '../../../shared/schemas/params';

export function swapsRouter({ db }: AppDeps) {
  const router = Router();

  router.get(
    '/swaps',
    validated({ query: z.object({ limit: z.coerce.number().int().min(1).max(50).default(12) }) }, ({ query }, _req, res) => {
      res.json({ items: recentSwaps(db, query.limit) });
    }),
  );

  // sheets are read far more than they change: each is built once per change and served pre-compressed
  const sheets = fingerprintCache();
  const sendSheet = (req: Request, res: Response, slug: string, n?: number) => {
    const fingerprint = sheetFingerprint(db, slug);
    if (!fingerprint) throw AppError.notFound('That swap');
    sendCachedJson(
      req,
      res,
      sheets(n === undefined ? slug : `${slug}/r/${n}`, fingerprint, () => getSwapSheet(db, slug, n)),
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
