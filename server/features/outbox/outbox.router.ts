import { Router } from 'express';
import type { AppDeps } from '../../app';
import { requireRole } from '../../middleware/require-role';
import type { OutboxResponse } from '../../../shared/schemas/submissions';
import { listOutbox } from './outbox.service';

export function outboxRouter({ db, config }: AppDeps) {
  const router = Router();
  router.get('/outbox', requireRole('moderator', 'admin'), (req, res) => {
    const body: OutboxResponse = { items: listOutbox(db, req.user!.role, { showSecrets: config.auth.mode === 'fake' }), delivering: Boolean(config.smtpUrl) };
    res.set('Cache-Control', 'private, no-store').json(body);
  });
  return router;
}
