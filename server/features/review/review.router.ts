import { Router, type Request } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { requirePermission } from '../../middleware/require-role';
import { perUserLimit } from '../../middleware/rate-limit';
import { idParamSchema, slugSchema } from '../../../shared/schemas/params';
import {
  bulkDeclineSchema,
  bulkResolveFlagsSchema,
  decisionNoteSchema,
  flagPageQuerySchema,
  flagSchema,
  reasonTemplateSchema,
  requiredReasonSchema,
  resolveFlagSchema,
} from '../../../shared/schemas/submissions';
import {
  approve,
  bulkDecline,
  bulkResolveFlags,
  flagPage,
  createFlag,
  createTemplate,
  deleteTemplate,
  listTemplates,
  resolveFlag,
  reviewDetail,
  reviewQueue,
  sendBackOrDecline,
  updateTemplate,
  type ReviewDeps,
} from './review.service';

const revisionParams = z.object({ revisionId: idParamSchema });
const idParams = z.object({ id: idParamSchema });
const queueQuery = z.object({
  status: z.enum(['in_review', 'sent_back']).default('in_review'),
  chassis: slugSchema.optional(),
  olderThanDays: z.coerce.number().int().min(0).max(3650).optional(),
});

/** Every decision is logged with who decided what; user text never goes into the log line. */
const logDecision = (req: Request, revisionId: number, action: string) =>
  req.log.info({ event: 'review_decision', revisionId, action, actorId: req.user!.id }, 'review decision');

export function reviewRouter({ db, clock, mailer, storage, logger, config }: AppDeps) {
  const router = Router();
  const deps: ReviewDeps = { db, clock, mailer, storage, logger, appUrl: config.appUrl };
  const review = requirePermission('review');

  router.get(
    '/review/queue',
    review,
    validated({ query: queueQuery }, ({ query }, _req, res) => {
      res.set('Cache-Control', 'private, no-store').json(reviewQueue(deps, query));
    }),
  );

  router.get('/review/templates', review, (_req, res) => {
    res.json({ items: listTemplates(db) });
  });
  router.post(
    '/review/templates',
    review,
    validated({ body: reasonTemplateSchema }, ({ body }, _req, res) => {
      res.status(201).json(createTemplate(deps, body));
    }),
  );
  router.patch(
    '/review/templates/:id',
    review,
    validated({ params: idParams, body: reasonTemplateSchema }, ({ params, body }, _req, res) => {
      res.json(updateTemplate(deps, params.id, body));
    }),
  );
  router.delete(
    '/review/templates/:id',
    review,
    validated({ params: idParams }, ({ params }, _req, res) => {
      deleteTemplate(db, params.id);
      res.status(204).end();
    }),
  );

  router.post(
    '/review/bulk-decline',
    review,
    validated({ body: bulkDeclineSchema }, async ({ body }, req, res) => {
      const declined = await bulkDecline(deps, req.user!, body.revisionIds, body.note);
      for (const id of declined) logDecision(req, id, 'declined');
      res.json({ declined });
    }),
  );

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
      const resolved = bulkResolveFlags(deps, req.user!, body.ids, body.note);
      req.log.info({ event: 'flags_resolved', flagIds: resolved, actorId: req.user!.id }, 'flags resolved in bulk');
      res.json({ resolved });
    }),
  );

  router.post(
    '/review/flags/:id/resolve',
    review,
    validated({ params: idParams, body: resolveFlagSchema }, ({ params, body }, req, res) => {
      const flag = resolveFlag(deps, req.user!, params.id, body.note);
      req.log.info({ event: 'flag_resolved', flagId: flag.id, actorId: req.user!.id }, 'flag resolved');
      res.json(flag);
    }),
  );

  router.get(
    '/review/:revisionId',
    review,
    validated({ params: revisionParams }, ({ params }, req, res) => {
      res.set('Cache-Control', 'private, no-store').json(reviewDetail(deps, req.user!, params.revisionId));
    }),
  );

  router.post(
    '/review/:revisionId/approve',
    review,
    validated({ params: revisionParams, body: decisionNoteSchema }, ({ params, body }, req, res) => {
      const revision = approve(deps, req.user!, params.revisionId, body.note);
      logDecision(req, params.revisionId, 'approved');
      res.json({ revision });
    }),
  );

  for (const [path, action] of [
    ['send-back', 'sent_back'],
    ['decline', 'declined'],
  ] as const) {
    router.post(
      `/review/:revisionId/${path}`,
      review,
      validated({ params: revisionParams, body: requiredReasonSchema }, async ({ params, body }, req, res) => {
        const revision = await sendBackOrDecline(deps, req.user!, params.revisionId, action, body.note);
        logDecision(req, params.revisionId, action);
        res.json({ revision });
      }),
    );
  }

  router.post(
    '/swaps/:slug/flags',
    requirePermission('flag'),
    perUserLimit({ limit: config.rateLimits.flagsPerHour, windowMs: 60 * 60 * 1000, what: 'flags' }),
    validated({ params: z.object({ slug: slugSchema }), body: flagSchema }, ({ params, body }, req, res) => {
      const flag = createFlag(deps, req.user!, params.slug, body.reason);
      req.log.info({ event: 'flag_created', flagId: flag.id, userId: req.user!.id }, 'swap flagged');
      res.status(201).json(flag);
    }),
  );

  return router;
}
