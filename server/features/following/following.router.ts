import express, { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-role';
import { idParamSchema } from '../../../shared/schemas/params';
import {
  createFollowSchema,
  digestFrequencyLabels,
  updateFollowSchema,
  type FollowList,
} from '../../../shared/schemas/following';
import {
  chassisLabel,
  createFollow,
  listFollows,
  setFollowFrequency,
  stopFollow,
  unsubscribe,
  unsubscribeTarget,
  type FollowTarget,
} from './following.service';
import {
  badUnsubscribeRequestPage,
  confirmUnsubscribePage,
  invalidUnsubscribePage,
  nothingToStopPage,
  ONE_CLICK_FIELD,
  ONE_CLICK_VALUE,
  unsubscribedPage,
} from './unsubscribe-pages';

const idParams = z.object({ id: idParamSchema });
const tokenParams = z.object({ token: z.string().max(80) });

/** What a follow is about, in the words of the pages and the digest. */
const followedThing = ({ car, chassis }: FollowTarget) => (car ? `your car “${car.nickname}”` : `the ${chassisLabel(chassis)}`);

/** The member's follows under /api/me/follows. */
export function followingRouter({ db, clock }: AppDeps) {
  const router = Router();
  router.use('/me/follows', requireUser);

  router.get('/me/follows', (req, res) => {
    const body: FollowList = { items: listFollows(db, req.user!.id) };
    res.set('Cache-Control', 'private, no-store').json(body);
  });

  router.post(
    '/me/follows',
    validated({ body: createFollowSchema }, ({ body }, req, res) => {
      const { item, created } = createFollow(db, clock, req.user!.id, body);
      res.status(created ? 201 : 200).json({ follow: item });
    }),
  );

  router.patch(
    '/me/follows/:id',
    validated({ params: idParams, body: updateFollowSchema }, ({ params, body }, req, res) => {
      res.json({ follow: setFollowFrequency(db, clock, req.user!.id, params.id, body.frequency) });
    }),
  );

  router.delete(
    '/me/follows/:id',
    validated({ params: idParams }, ({ params }, req, res) => {
      stopFollow(db, req.user!.id, params.id);
      res.status(204).end();
    }),
  );
  return router;
}

/**
 * A one-click body (RFC 8058): `List-Unsubscribe=One-Click`, sent form-encoded or as multipart form
 * data; read as text so both shapes are recognised without a multipart parser.
 */
function isOneClickBody(body: unknown): boolean {
  if (typeof body !== 'string') return false;
  if (new URLSearchParams(body).get(ONE_CLICK_FIELD) === ONE_CLICK_VALUE) return true;
  return new RegExp(`name="${ONE_CLICK_FIELD}"\\r?\\n\\r?\\n${ONE_CLICK_VALUE}\\r?\\n`).test(body);
}

/**
 * /unsubscribe/:token — the address a digest's List-Unsubscribe header and its last link carry. The
 * signed token is the only authority: no session or CSRF token is needed, and none is looked at.
 * GET only shows what would stop (mail scanners fetch links); POST with the one-click body stops it.
 */
export function unsubscribeRouter({ db, config }: AppDeps) {
  const router = Router();
  const secret = config.sessionSecret;

  router.get(
    '/unsubscribe/:token',
    validated({ params: tokenParams }, ({ params }, _req, res) => {
      res.set('Cache-Control', 'no-store');
      const found = unsubscribeTarget(db, secret, params.token);
      if (found.kind === 'invalid') return res.status(404).type('html').send(invalidUnsubscribePage());
      if (found.kind === 'gone') return res.type('html').send(nothingToStopPage());
      const frequency = digestFrequencyLabels[found.target.follow.frequency].toLowerCase();
      res.type('html').send(confirmUnsubscribePage(followedThing(found.target), frequency));
    }),
  );

  router.post(
    '/unsubscribe/:token',
    express.text({ type: () => true, limit: '4kb' }),
    validated({ params: tokenParams }, ({ params }, req, res) => {
      res.set('Cache-Control', 'no-store');
      if (!isOneClickBody(req.body)) return res.status(400).type('html').send(badUnsubscribeRequestPage());
      const done = unsubscribe(db, secret, params.token);
      if (done.kind === 'invalid') return res.status(404).type('html').send(invalidUnsubscribePage());
      if (done.kind === 'found')
        req.log?.info(
          { event: 'follow_unsubscribed', followId: done.target.follow.id, userId: done.target.follow.userId },
          'digest stopped by its link',
        );
      res.type('html').send(unsubscribedPage(done.kind === 'found' ? followedThing(done.target) : null));
    }),
  );
  return router;
}
