import { desc, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { mailOutbox, users } from '../../db/schema/index';
import type { OutboxMessage } from '../../../shared/schemas/submissions';
import { can, type Role } from '../../../shared/roles';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

/**
 * The newest messages first. Everyone on the desk sees what went out to which member and whether it
 * was delivered; the address and the mail server's answers (which often quote it) are for admins only.
 */
const withheld = 'This message signs its recipient in, so its text is not shown here.';

/** `showSecrets`: only with the local sign-in provider, where anyone may sign in as anyone anyway */
export function listOutbox(db: Db, viewerRole: Role, { showSecrets = false, limit = 200 } = {}): OutboxMessage[] {
  const admin = can(viewerRole, 'manage_users');
  return db
    .select({
      m: mailOutbox,
      // rows written without a member id (the demo seed, older rows) are matched by address
      login: sql<string | null>`coalesce(${users.login}, (select u.login from users u where u.email = ${mailOutbox.to} limit 1))`,
    })
    .from(mailOutbox)
    .leftJoin(users, eq(users.id, mailOutbox.userId))
    .orderBy(desc(mailOutbox.createdAt), desc(mailOutbox.id))
    .limit(limit)
    .all()
    .map(({ m, login }) => ({
      id: m.id,
      recipient: login,
      to: admin ? m.to : null,
      subject: m.subject,
      text: m.secret && !showSecrets ? withheld : m.text,
      html: m.secret && !showSecrets ? `<p>${withheld}</p>` : m.html,
      createdAt: m.createdAt.toISOString(),
      status: m.status,
      sentAt: iso(m.sentAt),
      delivery: admin
        ? {
            messageId: m.messageId,
            attempts: m.attempts,
            lastError: m.lastError,
            nextAttemptAt: m.status === 'retrying' || m.status === 'pending' ? iso(m.nextAttemptAt) : null,
          }
        : null,
    }));
}
