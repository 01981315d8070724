import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { type Agent, type Member, listen, signedInMember } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { reviewEvents, revisionPhotos, revisions, swaps } from '../../server/db/schema/index';
import { swapDataSchema } from '../../shared/schemas/swap-data';
import type { NextResponse, ReviewDetail, ReviewQueue, SubmissionView } from '../../shared/schemas/submissions';
import { CLAIM_MINUTES } from '../../shared/schemas/review-queue';

// The review desk for a queue of hundreds: filters and text search, claims that others see and that lapse,
// "open the next", the author's withdrawal, and one title per open submission per author.

let t: TestApp;
let server: Server;
let agent: () => Agent;
// the app's clock, moved forward to let claims lapse
let offsetMs = 0;
const now = () => new Date(Date.now() + offsetMs);

let rosa: Member;
let kai: Member;
let paul: Member;
let mo: Member;
let ada: Member;
let h31: number;
let h40: number;

const post = (m: Member, path: string, body: object = {}) => m.agent.post(path).set('x-csrf-token', m.token).send(body);
const del = (m: Member, path: string) => m.agent.delete(path).set('x-csrf-token', m.token);
const queue = async (m: Member, search = ''): Promise<ReviewQueue> => {
  const res = await m.agent.get(`/api/review/queue${search ? `?${search}` : ''}`);
  expect(res.status).toBe(200);
  return res.body;
};
const titles = (q: ReviewQueue) => q.items.map((i) => i.title);

let slugs = 0;
/** a submission at the desk, written straight into the database, sent `daysAgo` */
function atDesk(
  authorId: number,
  title: string,
  opts: { chassisId?: number; category?: 'brakes' | 'suspension'; daysAgo?: number; photo?: boolean; extra?: object } = {},
) {
  const { revisionIds, swapId } = addSwap(t.db, {
    slug: `desk-item-${++slugs}`,
    chassisId: opts.chassisId ?? h31,
    authorId,
    revisions: [{ status: 'in_review', data: swapDataSchema.parse(swapRecord({ title, ...opts.extra })) }],
  });
  const id = revisionIds[0]!;
  if (opts.category) t.db.update(swaps).set({ category: opts.category }).where(eq(swaps.id, swapId)).run();
  t.db
    .update(revisions)
    .set({ submittedAt: new Date(Date.now() - (opts.daysAgo ?? 0) * 86_400_000 - slugs * 1000) })
    .where(eq(revisions.id, id))
    .run();
  if (opts.photo)
    t.db
      .insert(revisionPhotos)
      .values({
        revisionId: id,
        fileId: `photo${slugs}xxxxxxxxxx`,
        width: 10,
        height: 10,
        bytes: 10,
        sha256: `s${slugs}`,
        createdAt: new Date(),
      })
      .run();
  return id;
}

/** `n` approved swaps by the author: one makes a trusted member, six an established one (shared/trust.ts) */
function publish(authorId: number, n: number) {
  for (let i = 0; i < n; i++)
    addSwap(t.db, { slug: `published-${authorId}-${i}`, chassisId: h40, authorId, revisions: [{ status: 'approved' }] });
}

beforeAll(async () => {
  t = await makeTestApp({ SUBMISSION_RATE_LIMIT: '1000' }, { now });
  ({ server, agent } = listen(t.app));
  h31 = addChassis(t.db).id;
  h40 = addChassis(t.db, 'halden-h40', { model: 'H40', code: 'H40', yearFrom: 1999, yearTo: 2006 }).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  kai = await signedInMember(t.db, agent, 'camber_kai');
  paul = await signedInMember(t.db, agent, 'pistonpaul');
  mo = await signedInMember(t.db, agent, 'gauge_mo', 'moderator');
  ada = await signedInMember(t.db, agent, 'ada_admin', 'admin');
});
afterAll(() => {
  server.close();
  t.close();
});

describe('queue filters and search', () => {
  let ids: Record<string, number>;
  beforeAll(() => {
    publish(kai.id, 2);
    publish(paul.id, 6);
    ids = {
      vela: atDesk(rosa.id, 'Vela calipers on the H31 front', { daysAgo: 10 }),
      arb: atDesk(kai.id, 'Anti-roll bar from the H40', { chassisId: h40, category: 'suspension', daysAgo: 2, photo: true }),
      regent: atDesk(paul.id, 'Regent rear rotors on the H40', {
        chassisId: h40,
        daysAgo: 0,
        photo: true,
        extra: {
          parts: [
            {
              role: 'Rear rotor',
              kind: 'rotor',
              name: 'Regent 300 mm rear rotor',
              maker: 'Tamsin',
              partNumbers: ['TR-300-R2'],
              quantity: 2,
            },
          ],
        },
      }),
    };
  });

  it('when no filter is set, then every submission at the desk is listed oldest first with its author’s standing and checks', async () => {
    const q = await queue(mo);
    expect(titles(q)).toEqual(['Vela calipers on the H31 front', 'Anti-roll bar from the H40', 'Regent rear rotors on the H40']);
    expect(q.total).toBe(3);
    const byTitle = Object.fromEntries(q.items.map((i) => [i.title, i]));
    expect(byTitle['Vela calipers on the H31 front']).toMatchObject({
      authorTrust: 'new',
      authorApproved: 0,
      checkOutcome: 'fail',
    });
    expect(byTitle['Anti-roll bar from the H40']).toMatchObject({
      authorTrust: 'trusted',
      authorApproved: 2,
      category: 'suspension',
    });
    expect(byTitle['Regent rear rotors on the H40']).toMatchObject({ authorTrust: 'established', authorApproved: 6 });
  });

  it('when filtered by chassis, category, age or author trust, then only what matches is listed', async () => {
    expect(titles(await queue(mo, 'chassis=halden-h40'))).toEqual([
      'Anti-roll bar from the H40',
      'Regent rear rotors on the H40',
    ]);
    expect(titles(await queue(mo, 'category=suspension'))).toEqual(['Anti-roll bar from the H40']);
    expect(titles(await queue(mo, 'olderThanDays=1'))).toEqual(['Vela calipers on the H31 front', 'Anti-roll bar from the H40']);
    expect(titles(await queue(mo, 'olderThanDays=7'))).toEqual(['Vela calipers on the H31 front']);
    expect(titles(await queue(mo, 'authorTrust=new'))).toEqual(['Vela calipers on the H31 front']);
    expect(titles(await queue(mo, 'authorTrust=trusted'))).toEqual(['Anti-roll bar from the H40']);
    expect(titles(await queue(mo, 'authorTrust=established'))).toEqual(['Regent rear rotors on the H40']);
    expect(titles(await queue(mo, 'chassis=halden-h40&authorTrust=new'))).toEqual([]);
  });

  it('when filtered by check outcome, then a submission with no photo needs a fix and one with a photo only asks for a closer look', async () => {
    expect(titles(await queue(mo, 'checks=fail'))).toEqual(['Vela calipers on the H31 front']);
    // with a photo, the record's only open point is the chassis' missing wheel fastening
    const attention = await queue(mo, 'checks=attention');
    expect(titles(attention)).toEqual(['Anti-roll bar from the H40', 'Regent rear rotors on the H40']);
    expect(attention.items.every((i) => i.failedChecks === 0 && i.attentionChecks > 0)).toBe(true);
    expect(titles(await queue(mo, 'checks=clear'))).toEqual([]);
  });

  it('when words are searched, then each must match the title, a part number (with or without separators), the author or the chassis', async () => {
    expect(titles(await queue(mo, 'q=vela'))).toEqual(['Vela calipers on the H31 front', 'Anti-roll bar from the H40']);
    expect(titles(await queue(mo, 'q=tr300r2'))).toEqual(['Regent rear rotors on the H40']);
    expect(titles(await queue(mo, 'q=TR-300'))).toEqual(['Regent rear rotors on the H40']);
    expect(titles(await queue(mo, 'q=camber_kai'))).toEqual(['Anti-roll bar from the H40']);
    expect(titles(await queue(mo, 'q=h40%20regent'))).toEqual(['Regent rear rotors on the H40']);
    expect(titles(await queue(mo, 'q=%25'))).toEqual([]);
  });

  it('when a filter value is not one the desk knows, then it is a 400 naming that field', async () => {
    for (const [search, field] of [
      ['authorTrust=famous', 'authorTrust'],
      ['checks=maybe', 'checks'],
      ['category=paint', 'category'],
      ['olderThanDays=-1', 'olderThanDays'],
      ['q=' + 'x'.repeat(101), 'q'],
    ]) {
      const res = await mo.agent.get(`/api/review/queue?${search}`);
      expect(res.status, search).toBe(400);
      expect(Object.keys(res.body.error.fields), search).toContain(field);
    }
  });

  it('when a member who is not a moderator asks for the queue, then it is 403', async () => {
    expect((await rosa.agent.get('/api/review/queue?q=vela')).status).toBe(403);
  });

  afterAll(() => {
    // the next describe arranges its own submissions
    for (const id of Object.values(ids)) t.db.update(revisions).set({ status: 'declined' }).where(eq(revisions.id, id)).run();
  });
});

describe('claims', () => {
  it(`when a moderator claims a submission, then others see who holds it, deciding is 409 for them, and it lapses after ${CLAIM_MINUTES} minutes`, async () => {
    const id = atDesk(rosa.id, 'Vela calipers, claimed and lapsing');
    const claimed = await post(mo, `/api/review/${id}/claim`);
    expect(claimed.status).toBe(200);
    expect(claimed.body.claim).toMatchObject({ by: { login: 'gauge_mo' }, mine: true });
    expect(Date.parse(claimed.body.claim.expiresAt) - now().getTime()).toBeGreaterThan((CLAIM_MINUTES - 1) * 60_000);

    // another moderator sees it taken, on the queue and the page
    const seen = (await queue(ada)).items.find((i) => i.revisionId === id)!;
    expect(seen.claim).toMatchObject({ by: { login: 'gauge_mo' }, mine: false });
    const detail: ReviewDetail = (await ada.agent.get(`/api/review/${id}`)).body;
    expect(detail.claim).toMatchObject({ by: { login: 'gauge_mo' }, mine: false });

    // and cannot take it or decide on it while it holds
    const taken = await post(ada, `/api/review/${id}/claim`);
    expect(taken.status).toBe(409);
    expect(taken.body.error.code).toBe('claimed');
    const decided = await post(ada, `/api/review/${id}/send-back`, { note: 'Add the torque figures' });
    expect(decided.status).toBe(409);
    expect(decided.body.error.message).toMatch(/@gauge_mo is working on this submission until/);
    expect(t.db.select().from(revisions).where(eq(revisions.id, id)).get()!.status).toBe('in_review');

    // after the claim lapses, anyone may take it
    offsetMs += (CLAIM_MINUTES + 1) * 60_000;
    expect((await queue(ada)).items.find((i) => i.revisionId === id)!.claim).toBeNull();
    const takeover = await post(ada, `/api/review/${id}/claim`);
    expect(takeover.status).toBe(200);
    expect(takeover.body.claim).toMatchObject({ by: { login: 'ada_admin' }, mine: true });
    expect((await queue(mo)).items.find((i) => i.revisionId === id)!.claim).toMatchObject({ by: { login: 'ada_admin' } });
  });

  it('when the holder decides, then the claim ends with the decision', async () => {
    const id = atDesk(rosa.id, 'Vela calipers, decided by the holder');
    expect((await post(mo, `/api/review/${id}/claim`)).status).toBe(200);
    const res = await post(mo, `/api/review/${id}/send-back`, { note: 'Add the torque figures' });
    expect(res.status).toBe(200);
    const detail: ReviewDetail = (await mo.agent.get(`/api/review/${id}`)).body;
    expect(detail.claim).toBeNull();
  });

  it('when nobody holds a submission, then any moderator decides without claiming it', async () => {
    const id = atDesk(rosa.id, 'Vela calipers, decided without a claim');
    expect((await post(ada, `/api/review/${id}/send-back`, { note: 'Add a photo of the bracket' })).status).toBe(200);
  });

  it('when a moderator releases a claim, theirs or a colleague’s, then the submission is free again', async () => {
    const id = atDesk(rosa.id, 'Vela calipers, released');
    expect((await post(mo, `/api/review/${id}/claim`)).status).toBe(200);
    const released = await del(ada, `/api/review/${id}/claim`);
    expect(released.status).toBe(200);
    expect(released.body.claim).toBeNull();
    expect((await queue(mo)).items.find((i) => i.revisionId === id)!.claim).toBeNull();
    expect((await post(ada, `/api/review/${id}/claim`)).status).toBe(200);
    expect((await del(ada, `/api/review/${id}/claim`)).status).toBe(200);
  });

  it('when a moderator claims their own submission, then it is 403, and a draft is 404', async () => {
    const own = atDesk(mo.id, 'A moderator’s own swap at the desk');
    expect((await post(mo, `/api/review/${own}/claim`)).status).toBe(403);
    const { revisionIds } = addSwap(t.db, {
      slug: 'a-draft-only',
      chassisId: h31,
      authorId: rosa.id,
      revisions: [{ status: 'draft' }],
    });
    expect((await post(mo, `/api/review/${revisionIds[0]}/claim`)).status).toBe(404);
  });
});

describe('open the next', () => {
  it('when two moderators ask for the next at once, then each gets a different unclaimed one in the filter, never their own', async () => {
    t.db.update(revisions).set({ status: 'declined' }).where(eq(revisions.status, 'in_review')).run();
    const first = atDesk(kai.id, 'Next: oldest on the H40', { chassisId: h40, daysAgo: 5 });
    const second = atDesk(paul.id, 'Next: newer on the H40', { chassisId: h40, daysAgo: 1 });
    atDesk(rosa.id, 'Next: on the H31', { daysAgo: 9 });
    const own = atDesk(mo.id, 'Next: the moderator’s own', { chassisId: h40, daysAgo: 8 });
    const [a, b] = await Promise.all([
      post(mo, '/api/review/next?chassis=halden-h40'),
      post(ada, '/api/review/next?chassis=halden-h40'),
    ]);
    const forMo = (a.body as NextResponse).revisionId!;
    const forAda = (b.body as NextResponse).revisionId!;
    expect([first, second]).toContain(forMo);
    expect([first, second, own]).toContain(forAda);
    expect(forAda).not.toBe(forMo);
    // each is claimed by the one who got it
    const claims = Object.fromEntries(
      (await queue(ada, 'chassis=halden-h40')).items.map((i) => [i.revisionId, i.claim?.by.login]),
    );
    expect(claims[forMo]).toBe('gauge_mo');
    expect(claims[forAda]).toBe('ada_admin');

    // what is left for mo: the H40 one nobody holds, unless only his own is left
    const left = [first, second].filter((id) => id !== forMo && id !== forAda);
    const again = await post(mo, '/api/review/next?chassis=halden-h40', { after: forMo });
    expect(again.body.revisionId).toBe(left[0] ?? null);
    const none = await post(mo, '/api/review/next?chassis=halden-h40', { after: again.body.revisionId ?? undefined });
    expect(
      none.body.revisionId === null || none.body.revisionId === forMo || none.body.revisionId === again.body.revisionId,
    ).toBe(true);
  });
});

describe('withdraw and one title per open submission', () => {
  const record = (title: string) => ({
    chassisId: h31,
    axle: 'front',
    category: 'brakes',
    data: swapRecord({ title }),
    body: '',
  });

  it('when the author withdraws a submission at the desk, then it is a draft again, the desk no longer lists it and its claim goes', async () => {
    const created: SubmissionView = (await post(rosa, '/api/submissions', record('Vela calipers, withdrawn again'))).body;
    expect((await post(rosa, `/api/submissions/${created.id}/submit`)).status).toBe(200);
    expect((await post(mo, `/api/review/${created.id}/claim`)).status).toBe(200);
    expect((await queue(mo)).items.some((i) => i.revisionId === created.id)).toBe(true);

    // nobody else may withdraw it
    expect([403, 404]).toContain((await post(kai, `/api/submissions/${created.id}/withdraw`)).status);
    expect([403, 404]).toContain((await post(mo, `/api/submissions/${created.id}/withdraw`)).status);

    const res = await post(rosa, `/api/submissions/${created.id}/withdraw`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'draft', editable: true, submittedAt: null });
    expect((await queue(mo)).items.some((i) => i.revisionId === created.id)).toBe(false);
    expect((await mo.agent.get(`/api/review/${created.id}`)).status).toBe(404);
    const events = t.db.select().from(reviewEvents).where(eq(reviewEvents.revisionId, created.id)).all();
    expect(events.map((e) => e.action)).toEqual(['submitted', 'withdrawn']);

    // a draft is not withdrawn twice; it can be sent again
    expect((await post(rosa, `/api/submissions/${created.id}/withdraw`)).status).toBe(409);
    expect((await post(rosa, `/api/submissions/${created.id}/submit`)).status).toBe(200);
  });

  it('when a moderator decided first, then the withdrawal is 409 and the decision stands', async () => {
    const created: SubmissionView = (await post(rosa, '/api/submissions', record('Vela calipers, decided before withdrawal')))
      .body;
    await post(rosa, `/api/submissions/${created.id}/submit`);
    expect((await post(mo, `/api/review/${created.id}/send-back`, { note: 'Add the torque figures' })).status).toBe(200);
    const res = await post(rosa, `/api/submissions/${created.id}/withdraw`);
    expect(res.status).toBe(409);
    expect(t.db.select().from(revisions).where(eq(revisions.id, created.id)).get()!.status).toBe('sent_back');
  });

  it('when a member starts a second open submission with a title they already use, then it is 409 on data.title, case aside, and nothing is stored', async () => {
    const first = await post(kai, '/api/submissions', record('Regent rear rotors on the H31'));
    expect(first.status).toBe(201);
    const before = t.db.select().from(revisions).all().length;
    const again = await post(kai, '/api/submissions', record('REGENT rear rotors on the H31'));
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('title_taken');
    expect(again.body.error.fields['data.title']).toMatch(/already have an open submission called/);
    expect(t.db.select().from(revisions).all().length).toBe(before);

    // another member may use it; so may kai once the first is no longer open
    expect((await post(paul, '/api/submissions', record('Regent rear rotors on the H31'))).status).toBe(201);
    await post(kai, `/api/submissions/${first.body.id}/submit`);
    expect((await post(kai, '/api/submissions', record('Regent rear rotors on the H31'))).status).toBe(409);
    expect((await post(mo, `/api/review/${first.body.id}/decline`, { note: 'Duplicate of a published swap' })).status).toBe(200);
    expect((await post(kai, '/api/submissions', record('Regent rear rotors on the H31'))).status).toBe(201);
  });

  it('when a member corrects a published swap whose title their own new draft shares, then the correction is allowed: it keeps its swap’s title', async () => {
    const title = 'Vela calipers on 330 mm rotors, shared title';
    addSwap(t.db, {
      slug: 'published-shared-title',
      chassisId: h40,
      authorId: rosa.id,
      revisions: [{ status: 'approved', data: swapDataSchema.parse(swapRecord({ title })) }],
    });
    expect((await post(kai, '/api/submissions', record(title))).status).toBe(201);
    const correction = await post(kai, '/api/submissions', { swapSlug: 'published-shared-title', data: swapRecord({ title }) });
    expect(correction.status).toBe(201);
  });

  it('when an autosave renames a draft to the title of another open one, then it is 409 on data.title and the saved draft keeps its title', async () => {
    const a: SubmissionView = (await post(paul, '/api/submissions', record('Vela calipers on the H31, first try'))).body;
    const b: SubmissionView = (await post(paul, '/api/submissions', record('Vela calipers on the H31, second try'))).body;
    const res = await paul.agent
      .patch(`/api/submissions/${b.id}`)
      .set('x-csrf-token', paul.token)
      .send({ data: swapRecord({ title: a.data.title }), body: '' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields['data.title']).toBeDefined();
    expect(t.db.select().from(revisions).where(eq(revisions.id, b.id)).get()!.data.title).toBe(
      'Vela calipers on the H31, second try',
    );
    // saving a draft under its own title is no conflict
    const same = await paul.agent
      .patch(`/api/submissions/${b.id}`)
      .set('x-csrf-token', paul.token)
      .send({ data: swapRecord({ title: b.data.title }), body: 'More notes' });
    expect(same.status).toBe(200);
  });
});
