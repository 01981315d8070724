import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { requirePermission } from '../../middleware/require-role';
import { perUserLimit } from '../../middleware/rate-limit';
import { idParamSchema, slugSchema } from '../../../shared/schemas/params';
import {
  bulkResolveFlagsSchema,
  flagPageQuerySchema,
  flagSchema,
  linkFlagSchema,
  resolveFlagSchema,
} from '../../../shared/schemas/submissions';
import { bulkResolveFlags, createFlag, flagPage, linkCorrection, resolveFlag, type FlagDeps } from './flags.service';

const idParams = z.object({ id: idParamSchema });

/** Flags: members raise them on a sheet; moderators link the correction that answers them and settle each with one outcome. */
export function flagsRouter({ db, clock, mailer, storage, logger, config }: AppDeps) {
  const router = Router();
  const deps: FlagDeps = { db, clock, mailer, storage, logger, appUrl: config.appUrl };
  const review = requirePermission('review');

  router.get(
    '/review/flags',
    review,
    validated({ query: flagPageQuerySchema }, ({ query }, _req, res) => {
      res.set('Cache-Control', 'private, no-store').json(flagPage(db, query.page));
    }),
  );

  router.post(
    '/review/flags/bulk-resolve',
    review,
    validated({ body: bulkResolveFlagsSchema }, ({ body }, req, res) => {
      const resolved = bulkResolveFlags(deps, req.user!, body.ids, body);
      req.log.info(
        { event: 'flags_resolved', flagIds: resolved, outcome: body.outcome, actorId: req.user!.id },
        'flags resolved in bulk',
      );
      res.json({ resolved });
    }),
  );

  router.post(
    '/review/flags/:id/resolve',
    review,
    validated({ params: idParams, body: resolveFlagSchema }, ({ params, body }, req, res) => {
      const flag = resolveFlag(deps, req.user!, params.id, body);
      req.log.info({ event: 'flag_resolved', flagId: flag.id, outcome: body.outcome, actorId: req.user!.id }, 'flag resolved');
      res.json(flag);
    }),
  );

  router.post(
    '/review/flags/:id/link',
    review,
    validated({ params: idParams, body: linkFlagSchema }, ({ params, body }, req, res) => {
      const flag = linkCorrection(deps, params.id, body.revisionId);
      req.log.info({ event: 'flag_linked', flagId: flag.id, revisionId: body.revisionId, actorId: req.user!.id }, 'flag linked');
      res.json(flag);
    }),
  );

  router.post(
    '/swaps/:slug/flags',
    requirePermission('flag'),
    perUserLimit({ limit: config.rateLimits.flagsPerHour, windowMs: 60 * 60 * 1000, what: 'flags' }),
    validated({ params: z.object({ slug: slugSchema }), body: flagSchema }, ({ params, body }, req, res) => {
      const flag = createFlag(deps, req.user!, params.slug, body);
      req.log.info({ event: 'flag_created', flagId: flag.id, kind: flag.kind, userId: req.user!.id }, 'swap flagged');
      res.status(201).json(flag);
    }),
  );

  return router;
}
