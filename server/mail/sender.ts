import { setTimeout as sleep } from 'node:timers/promises';
import { and, asc, eq, inArray, lte, min } from 'drizzle-orm';
import type { Transporter } from 'nodemailer';
import type { Db } from '../db/client';
import { mailOutbox } from '../db/schema/index';
import type { Clock } from '../lib/clock';
import type { Logger } from '../lib/logger';
import { newMessageId } from './message-id';

export type DeliveryOptions = {
  /** tries before a message is marked failed */
  maxAttempts: number;
  /** the wait after the first failed try; it doubles after each one, up to an hour */
  retryMs: number;
  /** the mail server's connect, greeting and answer timeouts */
  timeoutMs: number;
};

type Row = typeof mailOutbox.$inferSelect;
type Claimed = Row & { messageId: string };

const due = ['pending', 'retrying', 'sending'] as const;
const maxBackoffMs = 60 * 60 * 1000;
/** a second server process may write messages too: look for due ones at least this often */
const pollMs = 60 * 1000;

export const backoffMs = (retryMs: number, attempts: number) => Math.min(maxBackoffMs, retryMs * 2 ** Math.max(0, attempts - 1));

/** A 5xx answer is the mail server refusing this message for good; anything else (no connection, timeouts, 4xx) may pass later. */
const permanent = (err: unknown) => {
  const code = (err as { responseCode?: unknown }).responseCode;
  return typeof code === 'number' && code >= 500 && code < 600;
};

const errorText = (err: unknown) => (err instanceof Error ? err.message : String(err)).replace(/\s+/g, ' ').slice(0, 500);

/**
 * Delivers the outbox in the server process, one message at a time, after the request that wrote it has
 * answered. A message is claimed (status `sending`, with a lease) inside a write transaction, so two
 * processes never send the same row at once; a claim left behind by a crash lapses and the message is
 * tried again with the same Message-ID, which receivers use to drop a repeat.
 */
export function createSender({
  db,
  clock,
  logger,
  transport,
  from,
  domain,
  options,
}: {
  db: Db;
  clock: Clock;
  logger: Logger;
  transport: Transporter;
  from: string;
  domain: string;
  options: DeliveryOptions;
}) {
  // a claim outlives the slowest delivery the timeouts allow (connect, greet, a few commands)
  const leaseMs = Math.max(5 * 60 * 1000, options.timeoutMs * 10);
  let stopped = false;
  let again = false;
  let running: Promise<void> | null = null;
  let timer: NodeJS.Timeout | null = null;

  function claim(): Claimed | null {
    const now = clock.now();
    return db.transaction(
      (tx) => {
        const row = tx
          .select()
          .from(mailOutbox)
          .where(and(inArray(mailOutbox.status, [...due]), lte(mailOutbox.nextAttemptAt, now)))
          .orderBy(asc(mailOutbox.nextAttemptAt), asc(mailOutbox.id))
          .limit(1)
          .get();
        if (!row) return null;
        const claimed: Claimed = {
          ...row,
          status: 'sending',
          attempts: row.attempts + 1,
          messageId: row.messageId ?? newMessageId(domain),
          nextAttemptAt: new Date(now.getTime() + leaseMs),
        };
        tx.update(mailOutbox)
          .set({
            status: 'sending',
            attempts: claimed.attempts,
            messageId: claimed.messageId,
            nextAttemptAt: claimed.nextAttemptAt,
          })
          .where(eq(mailOutbox.id, row.id))
          .run();
        return claimed;
      },
      { behavior: 'immediate' },
    );
  }

  /** Records how a try went; a locked database gets a few more chances before the claim is left to lapse. */
  async function record(id: number, values: Partial<typeof mailOutbox.$inferInsert>) {
    for (let i = 0; ; i++) {
      try {
        db.update(mailOutbox)
          .set(values)
          .where(and(eq(mailOutbox.id, id), eq(mailOutbox.status, 'sending')))
          .run();
        return;
      } catch (err) {
        if (i >= 5) throw err;
        await sleep(200 * (i + 1));
      }
    }
  }

  async function deliver(row: Claimed) {
    try {
      await transport.sendMail({
        from,
        to: row.to,
        subject: row.subject,
        text: row.text,
        html: row.html,
        messageId: row.messageId,
        date: row.createdAt,
        headers: row.headers ?? undefined,
      });
      await record(row.id, { status: 'sent', sentAt: clock.now(), lastError: null, nextAttemptAt: null });
      logger.info({ event: 'mail_sent', outboxId: row.id, attempts: row.attempts }, 'message delivered');
    } catch (err) {
      const giveUp = permanent(err) || row.attempts >= options.maxAttempts;
      const next = giveUp ? null : new Date(clock.now().getTime() + backoffMs(options.retryMs, row.attempts));
      await record(row.id, { status: giveUp ? 'failed' : 'retrying', lastError: errorText(err), nextAttemptAt: next });
      // the error text may name the address; the log keeps to ids and codes
      logger.warn(
        {
          event: giveUp ? 'mail_failed' : 'mail_retrying',
          outboxId: row.id,
          attempts: row.attempts,
          code: (err as { code?: unknown }).code,
          responseCode: (err as { responseCode?: unknown }).responseCode,
          nextAttemptAt: next?.toISOString() ?? null,
        },
        giveUp ? 'message given up' : 'message will be tried again',
      );
    }
  }

  function nextDueInMs(): number {
    const row = db
      .select({ at: min(mailOutbox.nextAttemptAt) })
      .from(mailOutbox)
      .where(inArray(mailOutbox.status, [...due]))
      .get();
    if (!row?.at) return pollMs;
    return Math.min(pollMs, Math.max(0, row.at.getTime() - clock.now().getTime()));
  }

  function schedule(ms?: number) {
    if (timer) clearTimeout(timer);
    timer = null;
    if (stopped) return;
    let delay = ms;
    if (delay === undefined) {
      try {
        delay = nextDueInMs();
      } catch {
        delay = 1000;
      }
    }
    timer = setTimeout(wake, delay);
    timer.unref();
  }

  async function loop() {
    while (again && !stopped) {
      again = false;
      try {
        for (let row = claim(); row; row = stopped ? null : claim()) await deliver(row);
      } catch (err) {
        // most likely another process holds the database for a moment
        logger.warn({ event: 'mail_sender_error', err }, 'the mail sender will look again shortly');
        schedule(1000);
        return;
      }
    }
    schedule();
  }

  /** Looks for due messages now (after a commit that wrote one, or when a retry falls due). */
  function wake() {
    if (stopped) return;
    again = true;
    running ??= loop().finally(() => {
      running = null;
    });
  }

  return {
    wake,
    /** Starts no new delivery and waits (at most `capMs`) for the one in progress, so its result is recorded. */
    async stop(capMs = options.timeoutMs * 3) {
      stopped = true;
      if (timer) clearTimeout(timer);
      if (running) await Promise.race([running, sleep(capMs, undefined, { ref: false })]);
      transport.close();
    },
  };
}

export type Sender = ReturnType<typeof createSender>;
