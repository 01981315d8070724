import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { requirePermission, requireRole } from '../../middleware/require-role';
import { idParamSchema } from '../../../shared/schemas/params';
import { takedownSchema } from '../../../shared/schemas/takedowns';
import { createTakedown, listTakedowns, revertTakedown } from './takedowns.service';

/** Moderators take a published photo or write-up down; only an admin reverts a takedown. */
export function takedownsRouter({ db, clock }: AppDeps) {
  const router = Router();
  const deps = { db, clock };

  router.get('/review/takedowns', requirePermission('review'), (_req, res) => {
    res.set('Cache-Control', 'private, no-store').json({ items: listTakedowns(db) });
  });

  router.post(
    '/review/revisions/:revisionId/takedowns',
    requirePermission('review'),
    validated({ params: z.object({ revisionId: idParamSchema }), body: takedownSchema }, ({ params, body }, req, res) => {
      const item = createTakedown(deps, req.user!, params.revisionId, body);
      req.log.info(
        { event: 'takedown', takedownId: item.id, revisionId: params.revisionId, target: item.target, actorId: req.user!.id },
        'content taken down',
      );
      res.status(201).json(item);
    }),
  );

  router.post(
    '/review/takedowns/:id/revert',
    requireRole('admin'),
    validated({ params: z.object({ id: idParamSchema }) }, ({ params }, req, res) => {
      const item = revertTakedown(deps, req.user!, params.id);
      req.log.info({ event: 'takedown_reverted', takedownId: item.id, actorId: req.user!.id }, 'takedown reverted');
      res.json(item);
    }),
  );

  return router;
}
