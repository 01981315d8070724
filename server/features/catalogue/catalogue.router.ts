import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { idParamSchema, slugSchema } from '../../../shared/schemas/params';
import { getChassisPage, getPartPage, listChassis } from './catalogue.service';

export function catalogueRouter({ db }: AppDeps) {
  const router = Router();
  router.get('/chassis', (_req, res) => {
    res.json({ items: listChassis(db) });
  });
  router.get(
    '/chassis/:slug',
    validated({ params: z.object({ slug: slugSchema }) }, ({ params }, _req, res) => {
      res.json(getChassisPage(db, params.slug));
    }),
  );
  router.get(
    '/parts/:id',
    validated({ params: z.object({ id: idParamSchema }) }, ({ params }, _req, res) => {
      res.json(getPartPage(db, params.id));
    }),
  );
  return router;
}
