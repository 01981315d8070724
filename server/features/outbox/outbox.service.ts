import { desc } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { mailOutbox } from '../../db/schema/index';
import type { OutboxMessage } from '../../../shared/schemas/submissions';

/** The newest messages first; the outbox keeps every message built, sent through SMTP or not. */
export function listOutbox(db: Db, limit = 200): OutboxMessage[] {
  return db
    .select()
    .from(mailOutbox)
    .orderBy(desc(mailOutbox.createdAt), desc(mailOutbox.id))
    .limit(limit)
    .all()
    .map((m) => ({
      id: m.id,
      to: m.to,
      subject: m.subject,
      text: m.text,
      html: m.html,
      createdAt: m.createdAt.toISOString(),
      sentAt: m.sentAt ? m.sentAt.toISOString() : null,
    }));
}
