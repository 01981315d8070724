import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { csrfToken, listen, signIn, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { chassis, mailOutbox, revisions, swaps } from '../../server/db/schema/index';
import { expireAbandonedDrafts } from '../../server/features/submissions/draft-expiry';

// Drafts nobody touches for months hold photos forever. An abandoned draft gets an e-mail first; if it
// is still untouched when the notice runs out, it is removed with its photos and any chassis it proposed.

const DAY = 24 * 60 * 60 * 1000;
let now = new Date('2026-06-01T09:00:00Z').getTime();
const clock = { now: () => new Date(now) };

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let rosa: Member;
let jpeg: Buffer;

beforeAll(async () => {
  t = await makeTestApp({ DRAFT_IDLE_DAYS: '90', DRAFT_NOTICE_DAYS: '14' }, clock);
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  jpeg = await sharp({ create: { width: 320, height: 240, channels: 3, background: '#1d4d3a' } })
    .jpeg()
    .toBuffer();
});
afterAll(() => {
  server.close();
  t.close();
});

const sweep = () =>
  expireAbandonedDrafts({
    db: t.db,
    storage: t.storage,
    mailer: t.mailer,
    clock,
    logger: t.logger,
    appUrl: t.config.appUrl,
    expiry: t.config.draftExpiry,
  });
const mailsTo = (login: string) =>
  t.db
    .select()
    .from(mailOutbox)
    .all()
    .filter((m) => m.to.startsWith(login));
const revisionRow = (id: number) => t.db.select().from(revisions).where(eq(revisions.id, id)).get();

/** After the clock has moved on by weeks, the old session has ended: sign in again. */
async function freshSession(m: Member): Promise<Member> {
  const a = agent();
  await signIn(a, m.login);
  return { ...m, agent: a, token: await csrfToken(a) };
}

describe('abandoned drafts', () => {
  it('when a draft is untouched past the idle time, then its author is e-mailed once; when still untouched after the notice, it is removed with its photos and proposed chassis', async () => {
    const created = await rosa.agent
      .post('/api/submissions')
      .set('x-csrf-token', rosa.token)
      .send({
        newChassis: {
          make: 'Tamsin',
          model: 'Regent',
          code: 'TR9',
          yearFrom: 1994,
          lugCount: 5,
          pcdMm: 114.3,
          centreBoreMm: 67.1,
          wheelBoltThread: 'M12x1.5',
        },
        axle: 'rear',
        category: 'brakes',
        data: swapRecord({ title: 'Regent rear rotors I never finished' }),
      });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    const up = await rosa.agent
      .post(`/api/submissions/${id}/photos`)
      .set('x-csrf-token', rosa.token)
      .attach('photos', jpeg, 'a.jpg');
    const fileId = up.body.photos[0].id as string;

    now += 89 * DAY;
    await expect(sweep()).resolves.toEqual({ warned: 0, removed: 0 });
    now += 2 * DAY;
    await expect(sweep()).resolves.toEqual({ warned: 1, removed: 0 });
    const [notice] = mailsTo('rivet_rosa');
    expect(notice!.subject).toBe('Your draft will be removed: Regent rear rotors I never finished');
    expect(notice!.text).toContain('14 September 2026');
    expect(notice!.text).toContain(`/submissions/${id}/edit`);
    // a second sweep does not e-mail again
    await expect(sweep()).resolves.toEqual({ warned: 0, removed: 0 });
    expect(mailsTo('rivet_rosa')).toHaveLength(1);

    now += 13 * DAY;
    await expect(sweep()).resolves.toEqual({ warned: 0, removed: 0 });
    expect(revisionRow(id)).toBeDefined();
    now += 2 * DAY;
    await expect(sweep()).resolves.toEqual({ warned: 0, removed: 1 });
    expect(revisionRow(id)).toBeUndefined();
    expect(t.db.select().from(swaps).where(eq(swaps.id, created.body.swapId)).get()).toBeUndefined();
    expect(t.db.select().from(chassis).where(eq(chassis.id, created.body.chassis.id)).get()).toBeUndefined();
    expect(await t.storage.exists(fileId)).toBe(false);
    expect(await t.storage.exists(`${fileId}_t`)).toBe(false);
  });

  it('when the author saves the draft after the notice, or keeps it, then it stays, and the next notice comes only after another idle period', async () => {
    let member = await freshSession(rosa);
    const created = await member.agent
      .post('/api/submissions')
      .set('x-csrf-token', member.token)
      .send({ chassisId, axle: 'front', category: 'brakes', data: swapRecord({ title: 'A draft I come back to' }) });
    const id = created.body.id as number;
    const mailsBefore = mailsTo('rivet_rosa').length;

    now += 91 * DAY;
    await expect(sweep()).resolves.toEqual({ warned: 1, removed: 0 });
    member = await freshSession(member);
    const seen = await member.agent.get(`/api/submissions/${id}`);
    expect(seen.body.expiresAt).toBe(new Date(now + 14 * DAY).toISOString());
    const kept = await member.agent.post(`/api/submissions/${id}/keep`).set('x-csrf-token', member.token);
    expect(kept.status).toBe(200);
    expect(kept.body.expiresAt).toBeNull();

    now += 20 * DAY;
    await expect(sweep()).resolves.toEqual({ warned: 0, removed: 0 });
    expect(revisionRow(id)).toBeDefined();
    now += 71 * DAY;
    await expect(sweep()).resolves.toEqual({ warned: 1, removed: 0 });
    expect(mailsTo('rivet_rosa')).toHaveLength(mailsBefore + 2);

    // a save is as good as keeping it
    member = await freshSession(member);
    const saved = await member.agent
      .patch(`/api/submissions/${id}`)
      .set('x-csrf-token', member.token)
      .send({ data: swapRecord({ title: 'A draft I come back to, again' }) });
    expect(saved.status).toBe(200);
    now += 30 * DAY;
    await expect(sweep()).resolves.toEqual({ warned: 0, removed: 0 });
    expect(revisionRow(id)).toBeDefined();
  });

  it('when a revision is in review or sent back, then it never expires; another member cannot keep someone’s draft', async () => {
    let member = await freshSession(rosa);
    const created = await member.agent
      .post('/api/submissions')
      .set('x-csrf-token', member.token)
      .send({ chassisId, axle: 'front', category: 'brakes', data: swapRecord({ title: 'Sent and waiting a long time' }) });
    const id = created.body.id as number;
    expect((await member.agent.post(`/api/submissions/${id}/submit`).set('x-csrf-token', member.token)).status).toBe(200);
    now += 400 * DAY;
    const result = await sweep();
    expect(revisionRow(id)!.status).toBe('in_review');
    expect(revisionRow(id)!.expiryWarnedAt).toBeNull();
    expect(result.removed).toBe(0);

    member = await freshSession(member);
    const draft = await member.agent
      .post('/api/submissions')
      .set('x-csrf-token', member.token)
      .send({ chassisId, axle: 'front', category: 'brakes', data: swapRecord({ title: 'Mine alone' }) });
    const other = await signedInMember(t.db, agent, 'camber_kai');
    expect((await other.agent.post(`/api/submissions/${draft.body.id}/keep`).set('x-csrf-token', other.token)).status).toBe(404);
  });
});
