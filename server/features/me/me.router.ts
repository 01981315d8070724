import { Router } from 'express';
import type { Db } from '../../db/client';
import type { Clock } from '../../lib/clock';
import { requireUser } from '../../middleware/require-role';
import { validated } from '../../middleware/validate';
import { csrfTokenFor } from '../../middleware/csrf';
import { updateMeSchema, type MeResponse } from '../../../shared/schemas/me';
import { getMe, updateMe } from './me.service';

export function meRouter({ db, clock }: { db: Db; clock: Clock }) {
  const router = Router();

  router.get('/me', (req, res) => {
    // a visitor gets no token: it would need a session, and a session row per anonymous visit
    const user = req.user ? getMe(db, req.user.id) : null;
    const body: MeResponse = { user, csrfToken: user ? csrfTokenFor(req) : null };
    res.set('Cache-Control', 'no-store').json(body);
  });

  router.patch(
    '/me',
    requireUser,
    validated({ body: updateMeSchema }, ({ body }, req, res) => {
      const user = updateMe(db, clock, req.user!.id, body);
      res.json({ user });
    }),
  );

  return router;
}
