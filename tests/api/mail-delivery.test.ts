import { afterEach, describe, expect, it } from 'vitest';
import { asc, eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { listen, signedInMember, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { startSmtp, startStalledSmtp } from './support/smtp';
import { freePort } from '../e2e/support/server';
import { mailOutbox } from '../../server/db/schema/index';

// The outbox against a real SMTP server on loopback: a decision never waits for the mail server,
// a message written while the server is down arrives once it is up, exactly once.

const cleanup: (() => unknown)[] = [];
afterEach(async () => {
  for (const fn of cleanup.splice(0).reverse()) await fn();
});

async function world(env: Record<string, string>) {
  const t = await makeTestApp(env);
  const { server, agent } = listen(t.app);
  cleanup.push(
    () => t.close(),
    () => server.close(),
  );
  const c = addChassis(t.db);
  const rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  const mo = await signedInMember(t.db, agent, 'gauge_mo', 'moderator');
  return { t, agent, rosa, mo, chassisId: c.id };
}

/** A swap by `author` waiting on the desk (arranged directly, so no "received" message is written). */
function inReview(t: TestApp, author: Member, chassisId: number, slug: string) {
  return addSwap(t.db, { slug, chassisId, authorId: author.id, revisions: [{ status: 'in_review' }] }).revisionIds[0];
}

async function timed<T>(fn: () => Promise<T>): Promise<{ ms: number; value: T }> {
  const start = performance.now();
  const value = await fn();
  return { ms: performance.now() - start, value };
}

const decide = (mo: Member, revisionId: number, action: 'approve' | 'decline' = 'approve') =>
  mo.agent
    .post(`/api/review/${revisionId}/${action}`)
    .set('x-csrf-token', mo.token)
    .send(action === 'approve' ? { note: 'Clear photos' } : { note: 'A duplicate of another swap' });

const rows = (t: TestApp) => t.db.select().from(mailOutbox).orderBy(asc(mailOutbox.id)).all();

describe('mail delivery through the outbox', () => {
  it('when the mail server is down, then a decision answers at once, and the message arrives once after the server comes up', async () => {
    const port = await freePort(); // nothing listens here yet
    const { t, rosa, mo, chassisId } = await world({
      SMTP_URL: `smtp://127.0.0.1:${port}`,
      MAIL_RETRY_MS: '150',
      SMTP_TIMEOUT_MS: '2000',
    });
    const revisionId = inReview(t, rosa, chassisId, 'h31-vela-front');

    const { ms, value: res } = await timed(() => decide(mo, revisionId));
    expect(res.status).toBe(200);
    expect(ms).toBeLessThan(1000);
    // written with the decision, then tried and refused by the closed port
    await expect.poll(() => rows(t)[0]?.status, { timeout: 5000 }).toBe('retrying');
    const waiting = rows(t)[0];
    expect(waiting).toMatchObject({ to: 'rivet_rosa@members.swapyard.invalid', subject: expect.stringMatching(/^Published: /) });
    expect(waiting.attempts).toBeGreaterThanOrEqual(1);
    expect(waiting.lastError).toMatch(/ECONNREFUSED/);

    const smtp = await startSmtp({ port });
    cleanup.push(() => smtp.close());
    await expect.poll(() => rows(t)[0].status, { timeout: 10_000 }).toBe('sent');
    const sent = rows(t)[0];
    expect(sent.sentAt).toBeInstanceOf(Date);
    expect(sent.lastError).toBeNull();
    // several more retry intervals pass: nothing is sent twice
    await new Promise((r) => setTimeout(r, 1000));
    expect(smtp.received).toHaveLength(1);
    expect(smtp.received[0]).toMatchObject({
      messageId: sent.messageId,
      to: ['rivet_rosa@members.swapyard.invalid'],
      subject: sent.subject,
    });
  });

  it('when the mail server accepts the connection and then stalls, then no request waits for it and the message is retried later', async () => {
    const stalled = await startStalledSmtp();
    cleanup.push(() => stalled.close());
    const { t, rosa, mo, chassisId } = await world({
      SMTP_URL: `smtp://127.0.0.1:${stalled.port}`,
      SMTP_TIMEOUT_MS: '700',
      MAIL_RETRY_MS: '60000',
    });
    const first = inReview(t, rosa, chassisId, 'h31-vela-front');
    const second = inReview(t, rosa, chassisId, 'h31-regent-rear');

    const a = await timed(() => decide(mo, first));
    expect(a.value.status).toBe(200);
    await expect.poll(() => stalled.connections(), { timeout: 3000 }).toBeGreaterThan(0);
    // the sender now hangs on the silent server; the next decision still answers at once
    const b = await timed(() => decide(mo, second, 'decline'));
    expect(b.value.status).toBe(200);
    expect(Math.max(a.ms, b.ms)).toBeLessThan(500);
    expect((await decide(mo, first)).status).toBe(409); // the decision was made once, not half

    // the short greeting timeout ends the attempt; the message waits for its next try
    await expect.poll(() => rows(t)[0].status, { timeout: 5000 }).toBe('retrying');
    const retrying = rows(t)[0];
    expect(retrying.lastError).toMatch(/greeting|timeout/i);
    expect(retrying.nextAttemptAt!.getTime()).toBeGreaterThan(Date.now() + 30_000);
  });

  it('when the mail server refuses the recipient for good, then the message is marked failed without more tries', async () => {
    const smtp = await startSmtp({ rejectRecipients: 'No such mailbox here' });
    cleanup.push(() => smtp.close());
    const { t, rosa, mo, chassisId } = await world({ SMTP_URL: `smtp://127.0.0.1:${smtp.port}`, MAIL_RETRY_MS: '50' });
    expect((await decide(mo, inReview(t, rosa, chassisId, 'h31-vela-front'))).status).toBe(200);
    await expect.poll(() => rows(t)[0]?.status, { timeout: 5000 }).toBe('failed');
    expect(rows(t)[0]).toMatchObject({ attempts: 1, lastError: expect.stringMatching(/550/) });
    expect(smtp.received).toHaveLength(0);
  });

  it('when the mail server stays down past the allowed tries, then the message is marked failed with the last error', async () => {
    const port = await freePort();
    const { t, agent, rosa, mo, chassisId } = await world({
      SMTP_URL: `smtp://127.0.0.1:${port}`,
      MAIL_RETRY_MS: '50',
      MAIL_MAX_ATTEMPTS: '3',
    });
    expect((await decide(mo, inReview(t, rosa, chassisId, 'h31-vela-front'))).status).toBe(200);
    await expect.poll(() => rows(t)[0]?.status, { timeout: 5000 }).toBe('failed');
    expect(rows(t)[0]).toMatchObject({ attempts: 3, lastError: expect.stringMatching(/ECONNREFUSED/), nextAttemptAt: null });

    const admin = await signedInMember(t.db, agent, 'ada_admin', 'admin');
    const outbox = await admin.agent.get('/api/outbox');
    expect(outbox.body.delivering).toBe(true);
    expect(outbox.body.items[0]).toMatchObject({
      status: 'failed',
      to: 'rivet_rosa@members.swapyard.invalid',
      delivery: { attempts: 3, lastError: expect.stringMatching(/ECONNREFUSED/) },
    });
    const asModerator = await mo.agent.get('/api/outbox');
    expect(asModerator.body.items[0]).toMatchObject({ status: 'failed', recipient: 'rivet_rosa', to: null, delivery: null });
  });

  it('when two server processes share the database, then each message is delivered once', async () => {
    const smtp = await startSmtp({ dataDelayMs: 20 });
    cleanup.push(() => smtp.close());
    const port = await freePort(); // down while the messages are written
    const { t, rosa, mo, chassisId } = await world({ SMTP_URL: `smtp://127.0.0.1:${port}`, MAIL_RETRY_MS: '60000' });
    for (let i = 0; i < 8; i++) expect((await decide(mo, inReview(t, rosa, chassisId, `h31-swap-${i}`))).status).toBe(200);
    await expect.poll(() => rows(t).every((r) => r.status === 'retrying'), { timeout: 5000 }).toBe(true);
    await t.mailer.stop();

    // two servers on the same file, both with a working mail server and every message due
    const env = { DATABASE_URL: t.config.databaseUrl, SMTP_URL: `smtp://127.0.0.1:${smtp.port}` };
    const first = await makeTestApp(env);
    const second = await makeTestApp(env);
    cleanup.push(
      () => first.close(),
      () => second.close(),
    );
    first.db
      .update(mailOutbox)
      .set({ nextAttemptAt: new Date(0) })
      .run();
    await expect.poll(() => rows(first).filter((r) => r.status === 'sent').length, { timeout: 10_000 }).toBe(8);
    await new Promise((r) => setTimeout(r, 300));
    const ids = smtp.received.map((m) => m.messageId);
    expect(ids).toHaveLength(8);
    expect(new Set(ids).size).toBe(8);
    expect(new Set(ids)).toEqual(new Set(rows(first).map((r) => r.messageId)));
  });

  it('when no mail server is configured, then messages are kept in the outbox and the decision still records them', async () => {
    const { t, rosa, mo, chassisId } = await world({});
    expect((await decide(mo, inReview(t, rosa, chassisId, 'h31-vela-front'))).status).toBe(200);
    expect(rows(t)).toEqual([
      expect.objectContaining({
        status: 'kept',
        attempts: 0,
        sentAt: null,
        messageId: expect.stringMatching(/^<\w+@localhost>$/),
      }),
    ]);
    expect(rows(t)[0].userId).toBe(rosa.id);
    expect(t.db.select().from(mailOutbox).where(eq(mailOutbox.status, 'pending')).all()).toEqual([]);
  });
});
