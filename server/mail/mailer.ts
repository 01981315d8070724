import nodemailer from 'nodemailer';
import type { Db, DbTransaction } from '../db/client';
import { mailOutbox } from '../db/schema/index';
import type { Clock } from '../lib/clock';
import type { Logger } from '../lib/logger';
import type { Config } from '../config';
import type { BuiltMessage } from './messages';
import { newMessageId } from './message-id';
import { createSender } from './sender';

/** `id` is null for an address with no account yet (a first e-mail sign-in link) */
export type Recipient = { id: number | null; email: string | null };

export type Mailer = {
  /**
   * Writes the message into the outbox inside the caller's transaction, so it exists exactly when the
   * change it reports does. Members without an e-mail address are skipped. Delivery starts after the commit.
   */
  queue: (tx: DbTransaction, to: Recipient, message: BuiltMessage) => void;
  /** Stops delivering; waits for a delivery in progress so its result is recorded. */
  stop: () => Promise<void>;
};

/**
 * nodemailer builds and sends every message. With SMTP_URL the sender in this process delivers the
 * outbox with short timeouts and retries; without it messages are `kept` in the outbox, which staff
 * read at /outbox. No request ever waits for the mail server.
 */
export function createMailer({
  db,
  clock,
  logger,
  config,
}: {
  db: Db;
  clock: Clock;
  logger: Logger;
  config: Pick<Config, 'smtpUrl' | 'mailFrom' | 'appUrl' | 'mailDelivery'>;
}): Mailer {
  const domain = new URL(config.appUrl).hostname || 'swapyard.invalid';
  const { timeoutMs } = config.mailDelivery;
  const sender = config.smtpUrl
    ? createSender({
        db,
        clock,
        logger,
        from: config.mailFrom,
        domain,
        options: config.mailDelivery,
        transport: nodemailer.createTransport({
          url: config.smtpUrl,
          connectionTimeout: timeoutMs,
          greetingTimeout: timeoutMs,
          socketTimeout: timeoutMs,
          dnsTimeout: timeoutMs,
        }),
      })
    : null;
  if (sender) setImmediate(sender.wake); // messages left from before a restart

  return {
    queue(tx, to, message) {
      if (!to.email) return;
      const now = clock.now();
      tx.insert(mailOutbox)
        .values({
          userId: to.id,
          to: to.email,
          ...message,
          messageId: newMessageId(domain),
          status: sender ? 'pending' : 'kept',
          nextAttemptAt: sender ? now : null,
          createdAt: now,
        })
        .run();
      // runs after the synchronous transaction has committed (or finds nothing if it rolled back)
      if (sender) setImmediate(sender.wake);
    },
    stop: async () => sender?.stop(),
  };
}
