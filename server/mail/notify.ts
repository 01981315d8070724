import type { Logger } from '../lib/logger';
import type { Mailer } from './mailer';
import type { BuiltMessage } from './messages';

/**
 * Sends one message to a member after the change it reports has been committed. Members without an
 * e-mail address are skipped; a mail failure is logged and never undoes the change.
 */
export async function notify(mailer: Mailer, logger: Logger, to: { id: number; email: string | null }, message: BuiltMessage) {
  if (!to.email) return;
  try {
    await mailer.send({ to: to.email, ...message });
  } catch (err) {
    logger.error({ err, event: 'mail_failed', userId: to.id }, 'a notification could not be sent');
  }
}
