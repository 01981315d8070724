import { Router, type Request } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { requirePermission } from '../../middleware/require-role';
import { idParamSchema } from '../../../shared/schemas/params';
import {
  bulkDeclineSchema,
  decisionNoteSchema,
  reasonTemplateSchema,
  requiredReasonSchema,
} from '../../../shared/schemas/submissions';
import {
  approve,
  bulkDecline,
  createTemplate,
  deleteTemplate,
  listTemplates,
  reviewDetail,
  sendBackOrDecline,
  updateTemplate,
  type ReviewDeps,
} from './review.service';
import { claimNext, reviewQueue } from './review-queue.service';
import { claimRevision, releaseClaim } from './review-claims.service';
import { reviewQueueQuerySchema } from '../../../shared/schemas/review-queue';

const revisionParams = z.object({ revisionId: idParamSchema });
const idParams = z.object({ id: idParamSchema });
const nextBody = z.object({ after: idParamSchema.optional() });

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
    validated({ query: reviewQueueQuerySchema }, ({ query }, req, res) => {
      res.set('Cache-Control', 'private, no-store').json(reviewQueue(deps, req.user!, query));
    }),
  );

  // the next submission in the moderator's filter, claimed for them; `after` is the one they just decided
  router.post(
    '/review/next',
    review,
    validated({ query: reviewQueueQuerySchema, body: nextBody }, ({ query, body }, req, res) => {
      const { page: _page, ...filters } = query;
      const next = claimNext(deps, req.user!, filters, body.after);
      if (next.revisionId !== null)
        req.log.info({ event: 'review_claim', revisionId: next.revisionId, actorId: req.user!.id }, 'submission claimed');
      res.json(next);
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
    '/review/:revisionId',
    review,
    validated({ params: revisionParams }, ({ params }, req, res) => {
      res.set('Cache-Control', 'private, no-store').json(reviewDetail(deps, req.user!, params.revisionId));
    }),
  );

  router.post(
    '/review/:revisionId/claim',
    review,
    validated({ params: revisionParams }, ({ params }, req, res) => {
      const claim = claimRevision(db, req.user!, params.revisionId, clock.now());
      req.log.info({ event: 'review_claim', revisionId: params.revisionId, actorId: req.user!.id }, 'submission claimed');
      res.json({ claim });
    }),
  );

  router.delete(
    '/review/:revisionId/claim',
    review,
    validated({ params: revisionParams }, ({ params }, req, res) => {
      const { releasedFrom } = releaseClaim(db, params.revisionId, clock.now());
      req.log.info(
        { event: 'review_claim_released', revisionId: params.revisionId, actorId: req.user!.id, heldBy: releasedFrom },
        'claim released',
      );
      res.json({ claim: null });
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

  return router;
}
