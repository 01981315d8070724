import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { flags, mailOutbox } from '../../server/db/schema/index';
import type { FlagPage, ReviewQueue } from '../../shared/schemas/submissions';

// A flag flood: one member sent 100 flags of 2 KB in a row, the desk listed them all in one answer, and
// every resolve sent an e-mail. Flags are rate limited, one open per member and swap, paged, and
// resolved in bulk with one message per member.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let authorId: number;
let kai: Member;
let paul: Member;
let mo: Member;
let swapNo = 0;

beforeAll(async () => {
  t = await makeTestApp({ FLAG_RATE_LIMIT: '6' });
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  authorId = addUser(t.db, 'rivet_rosa').id;
  kai = await signedInMember(t.db, agent, 'camber_kai');
  paul = await signedInMember(t.db, agent, 'pistonpaul');
  mo = await signedInMember(t.db, agent, 'gauge_mo', 'moderator');
});
afterAll(() => {
  server.close();
  t.close();
});

const publicSwap = () =>
  addSwap(t.db, { slug: `h31-flagged-${++swapNo}`, chassisId, authorId, revisions: [{ status: 'approved' }] });
const flag = (m: Member, slug: string, reason = 'The bracket bolt torque looks too low') =>
  m.agent.post(`/api/swaps/${slug}/flags`).set('x-csrf-token', m.token).send({ kind: 'other', reason });
const openFlagsOf = (reporterId: number) =>
  t.db
    .select()
    .from(flags)
    .all()
    .filter((f) => f.reporterId === reporterId && f.status === 'open');

/** Flag rows made directly, as many as a test needs (the API would rate-limit them). */
function flagRows(count: number, reporterId: number) {
  const now = Date.now();
  return Array.from({ length: count }, (_, i) => {
    const swap = publicSwap();
    const row = t.db
      .insert(flags)
      .values({
        swapId: swap.swapId,
        reporterId,
        reason: `Row ${i}: ${'x'.repeat(1900)}`,
        createdAt: new Date(now + i),
        updatedAt: new Date(now + i),
      })
      .returning()
      .get();
    return { ...row, title: `${swap.slug} revision 1` };
  });
}

describe('one open flag per member and swap', () => {
  it('when a member flags a swap they already flagged, then it is 409 until a moderator resolves the first', async () => {
    const swap = publicSwap();
    const first = await flag(paul, swap.slug);
    expect(first.status).toBe(201);
    const again = await flag(paul, swap.slug, 'And the rotor size is wrong too');
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('open_flag');
    expect(again.body.error.message).toMatch(/already flagged this swap/);
    // another member may flag the same swap
    expect((await flag(kai, swap.slug)).status).toBe(201);
    const resolved = await mo.agent
      .post(`/api/review/flags/${first.body.id}/resolve`)
      .set('x-csrf-token', mo.token)
      .send({ outcome: 'not_a_problem', note: 'Checked the figure' });
    expect(resolved.status).toBe(200);
    expect((await flag(paul, swap.slug, 'Now the rotor size looks wrong')).status).toBe(201);
  });

  it('when three flags of the same swap arrive at once, then one is stored', async () => {
    const swap = publicSwap();
    const before = openFlagsOf(paul.id).length;
    const answers = await Promise.all([flag(paul, swap.slug), flag(paul, swap.slug), flag(paul, swap.slug)]);
    expect(answers.map((a) => a.status).sort()).toEqual([201, 409, 409]);
    expect(openFlagsOf(paul.id).length).toBe(before + 1);
  });
});

describe('flag rate limit', () => {
  it('when a member sends more flags in an hour than allowed, then the next is 429 and not stored', async () => {
    const limited = await makeTestApp({ FLAG_RATE_LIMIT: '3' });
    const l = listen(limited.app);
    try {
      const c = addChassis(limited.db).id;
      const author = addUser(limited.db, 'rivet_rosa').id;
      const member = await signedInMember(limited.db, l.agent, 'camber_kai');
      const slugs = [1, 2, 3, 4].map(
        (i) =>
          addSwap(limited.db, { slug: `h31-limit-${i}`, chassisId: c, authorId: author, revisions: [{ status: 'approved' }] })
            .slug,
      );
      for (const slug of slugs.slice(0, 3)) {
        const res = await member.agent
          .post(`/api/swaps/${slug}/flags`)
          .set('x-csrf-token', member.token)
          .send({ kind: 'other', reason: 'x'.repeat(2000) });
        expect(res.status).toBe(201);
      }
      const fourth = await member.agent
        .post(`/api/swaps/${slugs[3]}/flags`)
        .set('x-csrf-token', member.token)
        .send({ kind: 'other', reason: 'x'.repeat(2000) });
      expect(fourth.status).toBe(429);
      expect(fourth.body.error.code).toBe('rate_limited');
      expect(limited.db.select().from(flags).all()).toHaveLength(3);
    } finally {
      l.server.close();
      limited.close();
    }
  });
});

describe('flags on the desk, in pages', () => {
  it('when 45 flags are open, then the queue carries the first page and the total, and the pages hold the rest oldest first', async () => {
    t.db.delete(flags).run();
    const rows = flagRows(45, kai.id);
    const queue = (await mo.agent.get('/api/review/queue')).body as ReviewQueue;
    expect(queue.counts.flags).toBe(45);
    expect(queue.flags).toHaveLength(20);
    expect(queue.flags.map((f) => f.id)).toEqual(rows.slice(0, 20).map((r) => r.id));

    const page1 = (await mo.agent.get('/api/review/flags')).body as FlagPage;
    expect(page1).toMatchObject({ total: 45, page: 1, pageSize: 20 });
    expect(page1.items.map((f) => f.id)).toEqual(rows.slice(0, 20).map((r) => r.id));
    const page3 = (await mo.agent.get('/api/review/flags?page=3')).body as FlagPage;
    expect(page3.items.map((f) => f.id)).toEqual(rows.slice(40).map((r) => r.id));
    expect(((await mo.agent.get('/api/review/flags?page=4')).body as FlagPage).items).toEqual([]);
    expect((await mo.agent.get('/api/review/flags?page=0')).status).toBe(400);
    // one page of 2 KB reasons stays small, whatever the number of open flags
    const raw = await mo.agent.get('/api/review/flags').buffer(true);
    expect(Buffer.byteLength(JSON.stringify(raw.body))).toBeLessThan(60_000);
    expect((await kai.agent.get('/api/review/flags')).status).toBe(403);
  });

  it('when a moderator resolves many flags at once, then all are resolved and each reporter gets one message', async () => {
    t.db.delete(flags).run();
    const fromKai = flagRows(3, kai.id);
    const fromPaul = flagRows(1, paul.id);
    const mailsBefore = t.db.select().from(mailOutbox).all().length;
    const res = await mo.agent
      .post('/api/review/flags/bulk-resolve')
      .set('x-csrf-token', mo.token)
      .send({ ids: [...fromKai, ...fromPaul].map((f) => f.id), outcome: 'duplicate', note: 'Reported before, in one go' });
    expect(res.status).toBe(200);
    expect(res.body.resolved).toHaveLength(4);
    const rows = t.db.select().from(flags).all();
    expect(
      rows.every(
        (r) =>
          r.status === 'resolved' &&
          r.outcome === 'duplicate' &&
          r.resolvedById === mo.id &&
          r.resolutionNote === 'Reported before, in one go',
      ),
    ).toBe(true);
    const mails = t.db.select().from(mailOutbox).all().slice(mailsBefore);
    expect(mails.map((m) => m.to).sort()).toEqual(['camber_kai@members.swapyard.invalid', 'pistonpaul@members.swapyard.invalid']);
    const toKai = mails.find((m) => m.to.startsWith('camber_kai'))!;
    expect(toKai.subject).toBe('What became of 3 of your flags');
    for (const f of fromKai) expect(toKai.text).toContain(f.title);
    expect(mails.find((m) => m.to.startsWith('pistonpaul'))!.subject).toMatch(/^Your flag on “.+”: Already reported$/);
  });

  it('when one flag of a batch is already resolved or unknown, then nothing changes and the answer names it', async () => {
    t.db.delete(flags).run();
    const [a, b] = flagRows(2, kai.id);
    t.db.update(flags).set({ status: 'resolved' }).where(eq(flags.id, b!.id)).run();
    const res = await mo.agent
      .post('/api/review/flags/bulk-resolve')
      .set('x-csrf-token', mo.token)
      .send({ ids: [a!.id, b!.id, 999_999], outcome: 'not_a_problem', note: 'Handled' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields['ids.1']).toMatch(/already resolved/);
    expect(res.body.error.fields['ids.2']).toMatch(/not found/);
    expect(t.db.select().from(flags).where(eq(flags.id, a!.id)).get()!.status).toBe('open');
  });
});
