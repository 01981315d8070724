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
    const body: MeResponse = { user: req.user ? getMe(db, req.user.id) : null, csrfToken: csrfTokenFor(req) };
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
