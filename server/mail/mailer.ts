import nodemailer from 'nodemailer';
import type { Db } from '../db/client';
import { mailOutbox } from '../db/schema/index';
import type { Clock } from '../lib/clock';

export type OutgoingMessage = { to: string; subject: string; text: string; html: string };
export type Mailer = { send: (message: OutgoingMessage) => Promise<void> };

/**
 * nodemailer builds every message. With SMTP_URL it is sent through that server; without it the
 * built message is kept in the mail_outbox table, which moderators read at /outbox.
 * Every message is recorded in the outbox either way, with sent_at set once SMTP accepted it.
 */
export function createMailer({ db, clock, smtpUrl, from }: { db: Db; clock: Clock; smtpUrl?: string; from: string }): Mailer {
  const transport = smtpUrl ? nodemailer.createTransport(smtpUrl) : nodemailer.createTransport({ jsonTransport: true });
  return {
    async send(message) {
      const info = await transport.sendMail({ from, ...message });
      db.insert(mailOutbox)
        .values({
          to: message.to,
          subject: message.subject,
          text: message.text,
          html: message.html,
          createdAt: clock.now(),
          sentAt: smtpUrl && info.accepted?.length ? clock.now() : null,
        })
        .run();
    },
  };
}
