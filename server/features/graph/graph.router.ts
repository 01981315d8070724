import { Router, type Response } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { idParamSchema, slugSchema } from '../../../shared/schemas/params';
import { whereElseQuerySchema } from '../../../shared/schemas/graph';
import { chassisGraph, partGraph, whereElse } from './graph.service';
import { SHARED_ANSWER } from '../../lib/cache-policy';

/** the same for every reader: a shared cache may keep it */
const sendPublic = (res: Response, body: unknown) => res.set('Cache-Control', SHARED_ANSWER).json(body);

export function graphRouter({ db }: AppDeps) {
  const router = Router();
  router.get(
    '/graph/parts/:id',
    validated({ params: z.object({ id: idParamSchema }) }, ({ params }, _req, res) => {
      sendPublic(res, partGraph(db, params.id));
    }),
  );
  router.get(
    '/graph/chassis/:slug',
    validated({ params: z.object({ slug: slugSchema }) }, ({ params }, _req, res) => {
      sendPublic(res, chassisGraph(db, params.slug));
    }),
  );
  router.get(
    '/graph/where-else',
    validated({ query: whereElseQuerySchema }, ({ query }, _req, res) => {
      sendPublic(res, whereElse(db, query.number));
    }),
  );
  return router;
}
