import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { idParamSchema, slugSchema } from '../../../shared/schemas/params';
import { pageFound } from '../../lib/page-status';
import { AppError } from '../../lib/app-error';
import { pageRoutes } from '../../../shared/page-routes';
import { requirePermission } from '../../middleware/require-role';
import { chassisVehicleInputSchema } from '../../../shared/schemas/vehicle';
import { getChassisPage, getPartPage, listChassis, setChassisVehicle } from './catalogue.service';
import { findPartMatch, searchParts } from './part-lookup.service';
import { partMatchQuerySchema, partSearchQuerySchema } from '../../../shared/schemas/catalogue';
import type { PartMatchResponse, PartSearchResponse } from '../../../shared/schemas/catalogue';
import { SHARED_ANSWER } from '../../lib/cache-policy';

export function catalogueRouter({ db, clock }: AppDeps) {
  const router = Router();
  router.get('/chassis', (_req, res) => {
    res.set('Cache-Control', SHARED_ANSWER).json({ items: listChassis(db) });
  });
  router.get(
    '/chassis/:slug',
    validated({ params: z.object({ slug: slugSchema }) }, ({ params }, req, res) => {
      const page = getChassisPage(db, params.slug, req.user);
      // a proposed chassis is answered only to its author and reviewers: never from a shared cache
      res.set('Cache-Control', page.proposed ? 'private, no-store' : SHARED_ANSWER).json(page);
    }),
  );
  // the stock figures that decide which axle locks first on every sheet of the chassis: reviewers keep them
  router.patch(
    '/chassis/:slug/vehicle',
    requirePermission('review'),
    validated({ params: z.object({ slug: slugSchema }), body: chassisVehicleInputSchema }, ({ params, body }, _req, res) => {
      res.json({ chassis: setChassisVehicle(db, clock, params.slug, body.vehicle) });
    }),
  );
  // the submission form's part picker and its "this part is already in the catalogue" offer
  router.get(
    '/parts',
    validated({ query: partSearchQuerySchema }, ({ query }, _req, res) => {
      const body: PartSearchResponse = { items: searchParts(db, query) };
      res.json(body);
    }),
  );
  router.get(
    '/parts/match',
    validated({ query: partMatchQuerySchema }, ({ query }, _req, res) => {
      const body: PartMatchResponse = { match: findPartMatch(db, query.maker, query.numbers) };
      res.json(body);
    }),
  );
  router.get(
    '/parts/:id',
    validated({ params: z.object({ id: idParamSchema }) }, ({ params }, _req, res) => {
      res.set('Cache-Control', SHARED_ANSWER).json(getPartPage(db, params.id));
    }),
  );
  return router;
}

/** The chassis and part pages answer 404 for a chassis or part the reader cannot open. */
export function cataloguePagesRouter({ db }: AppDeps) {
  const router = Router();
  router.get(
    pageRoutes.chassis,
    pageFound((req) => getChassisPage(db, String(req.params.slug), req.user)),
  );
  router.get(
    pageRoutes.part,
    pageFound((req) => {
      const id = idParamSchema.safeParse(req.params.id);
      if (!id.success) throw AppError.notFound('That part');
      return getPartPage(db, id.data);
    }),
  );
  return router;
}
