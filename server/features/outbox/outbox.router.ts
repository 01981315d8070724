import { Router } from 'express';
import type { AppDeps } from '../../app';
import { requireRole } from '../../middleware/require-role';
import { listOutbox } from './outbox.service';

export function outboxRouter({ db }: AppDeps) {
  const router = Router();
  router.get('/outbox', requireRole('moderator', 'admin'), (_req, res) => {
    res.set('Cache-Control', 'private, no-store').json({ items: listOutbox(db) });
  });
  return router;
}
