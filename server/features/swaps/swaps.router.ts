import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { getSwapSheet, recentSwaps } from './swaps.service';
import { slugSchema } from '../../../shared/schemas/params';

export function swapsRouter({ db }: AppDeps) {
  const router = Router();

  router.get(
    '/swaps',
    validated({ query: z.object({ limit: z.coerce.number().int().min(1).max(50).default(12) }) }, ({ query }, _req, res) => {
      res.json({ items: recentSwaps(db, query.limit) });
    }),
  );

  router.get(
    '/swaps/:slug',
    validated({ params: z.object({ slug: slugSchema }) }, ({ params }, _req, res) => {
      res.json(getSwapSheet(db, params.slug));
    }),
  );

  router.get(
    '/swaps/:slug/revisions/:n',
    validated(
      { params: z.object({ slug: slugSchema, n: z.coerce.number().int().min(1).max(100000) }) },
      ({ params }, _req, res) => {
        res.json(getSwapSheet(db, params.slug, params.n));
      },
    ),
  );

  return router;
}
