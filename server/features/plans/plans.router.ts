import { Router, type Request } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-role';
import { perAddressLimit } from '../../middleware/rate-limit';
import {
  adoptPlansSchema,
  createPlanSchema,
  deviceKeySchema,
  planIdSchema,
  updatePlanSchema,
  type PlanView,
} from '../../../shared/schemas/plans';
import { adoptPlans, createPlan, deletePlan, getPlan, listMyPlans, refreshPlan, updatePlan } from './plans.service';

const idParams = z.object({ id: planIdSchema });

/** A visitor's device proves it made a plan with the key it was given (header, never in the address). */
function deviceKeyOf(req: Request): string | undefined {
  const parsed = deviceKeySchema.safeParse(req.get('x-plan-key'));
  return parsed.success ? parsed.data : undefined;
}

/** Build plans under /api: anyone may make one (a visitor's is kept by their device); anyone with the address reads it. */
export function plansRouter({ db, clock }: AppDeps) {
  const router = Router();
  // visitors may make plans without an account, so plan making is held to a pace per address
  const making = perAddressLimit({ limit: 60, windowMs: 60 * 60 * 1000, what: 'new plans' });

  router.post(
    '/plans',
    making,
    validated({ body: createPlanSchema }, ({ body }, req, res) => {
      res.status(201).json(createPlan(db, clock, req.user, body));
    }),
  );

  router.get('/me/plans', requireUser, (req, res) => {
    res.set('Cache-Control', 'private, no-store').json(listMyPlans(db, req.user!));
  });

  router.post(
    '/me/plans/adopt',
    requireUser,
    validated({ body: adoptPlansSchema }, ({ body }, req, res) => {
      res.json(adoptPlans(db, clock, req.user!, body));
    }),
  );

  router.get(
    '/plans/:id',
    validated({ params: idParams }, ({ params }, req, res) => {
      const body: PlanView = getPlan(db, params.id, req.user, deviceKeyOf(req));
      // a plan changes when its owner edits it: always revalidated, never stored by a shared cache
      res.set('Cache-Control', 'private, no-cache').json(body);
    }),
  );

  router.patch(
    '/plans/:id',
    validated({ params: idParams, body: updatePlanSchema }, ({ params, body }, req, res) => {
      updatePlan(db, clock, params.id, req.user, deviceKeyOf(req), body);
      res.json(getPlan(db, params.id, req.user, deviceKeyOf(req)));
    }),
  );

  router.post(
    '/plans/:id/refresh',
    validated({ params: idParams }, ({ params }, req, res) => {
      refreshPlan(db, clock, params.id, req.user, deviceKeyOf(req));
      res.json(getPlan(db, params.id, req.user, deviceKeyOf(req)));
    }),
  );

  router.delete(
    '/plans/:id',
    validated({ params: idParams }, ({ params }, req, res) => {
      deletePlan(db, params.id, req.user, deviceKeyOf(req));
      res.status(204).end();
    }),
  );

  return router;
}
