import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import pino from 'pino';
import { Writable } from 'node:stream';
import { and, desc, eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { createApp } from '../../server/app';
import { type Agent, type Member, csrfToken, listen, signIn, signedInMember } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { chassis, flags, mailOutbox, parts, reviewEvents, revisions, swaps, users } from '../../server/db/schema/index';
import type { SwapDataInput } from '../../shared/schemas/swap-data';
import type { OutboxMessage, ReviewDetail, ReviewQueue, SubmissionView } from '../../shared/schemas/submissions';

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;

let rosa: Member;
let kai: Member;
let paul: Member;
let mo: Member;
let ada: Member;

const member = (login: string, role: 'member' | 'moderator' | 'admin' = 'member') => signedInMember(t.db, agent, login, role);

const post = (m: Member, path: string, body?: object) => m.agent.post(path).set('x-csrf-token', m.token).send(body);
const patch = (m: Member, path: string, body: object) => m.agent.patch(path).set('x-csrf-token', m.token).send(body);

async function submitted(m: Member, data: SwapDataInput = swapRecord(), extra: object = {}): Promise<SubmissionView> {
  const created = await post(m, '/api/submissions', {
    chassisId,
    axle: 'front',
    category: 'brakes',
    data,
    body: 'Fitted over a weekend.',
    ...extra,
  });
  expect(created.status).toBe(201);
  const sent = await post(m, `/api/submissions/${created.body.id}/submit`);
  expect(sent.status).toBe(200);
  return sent.body;
}

const outboxTo = (m: Member) =>
  t.db
    .select()
    .from(mailOutbox)
    .where(eq(mailOutbox.to, `${m.login}@members.swapyard.invalid`))
    .orderBy(desc(mailOutbox.id))
    .all();

let photo: Buffer;

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await member('rivet_rosa');
  kai = await member('camber_kai');
  paul = await member('pistonpaul');
  // sign-in copies the provider's address; this member has none on file
  t.db.update(users).set({ email: null }).where(eq(users.id, paul.id)).run();
  mo = await member('gauge_mo', 'moderator');
  ada = await member('ada_admin', 'admin');
  photo = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 29, g: 77, b: 58 } } })
    .png()
    .toBuffer();
});
afterAll(() => {
  server.close();
  t.close();
});

describe('the whole lifecycle of a swap', () => {
  it('draft → submit → send back → edit → resubmit → approve → public → correction → approved correction supersedes', async () => {
    // --- a member writes a draft with a photo and a part that is not in the catalogue yet
    const created = await post(rosa, '/api/submissions', {
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: swapRecord(),
      body: 'First write-up.',
    });
    expect(created.status).toBe(201);
    const id = created.body.id as number;
    const slug = created.body.swapSlug as string;
    const up = await rosa.agent
      .post(`/api/submissions/${id}/photos`)
      .set('x-csrf-token', rosa.token)
      .attach('photos', photo, 'fitted.png');
    expect(up.status).toBe(201);

    // --- submitted: it reaches the desk, the author is told
    expect((await post(rosa, `/api/submissions/${id}/submit`)).status).toBe(200);
    expect(outboxTo(rosa)[0].subject).toBe('At the review desk: Vela four-piston calipers on 330 mm rotors');
    const queue = await mo.agent.get('/api/review/queue');
    expect(queue.status).toBe(200);
    const item = (queue.body as ReviewQueue).items.find((i) => i.revisionId === id)!;
    expect(item).toMatchObject({
      swapSlug: slug,
      number: 1,
      isCorrection: false,
      status: 'in_review',
      axle: 'front',
      chassis: { slug: 'halden-h31' },
      author: { login: 'rivet_rosa' },
    });
    expect(item.failedChecks).toBe(0);

    // --- a member cannot review
    expect((await kai.agent.get('/api/review/queue')).status).toBe(403);
    expect((await kai.agent.get(`/api/review/${id}`)).status).toBe(403);
    expect((await post(kai, `/api/review/${id}/approve`, {})).status).toBe(403);

    // --- sent back with reasons; the reasons reach the member, escaped in the HTML part
    expect((await post(mo, `/api/review/${id}/send-back`, {})).status).toBe(400);
    const reasons = 'Clearance < 3 mm & the "bracket" photo <b>missing</b>';
    const back = await post(mo, `/api/review/${id}/send-back`, { note: reasons });
    expect(back.status).toBe(200);
    expect(back.body.revision).toMatchObject({
      status: 'sent_back',
      reviewNote: 'Clearance < 3 mm & the "bracket" photo missing',
    });
    const sentBackMail = outboxTo(rosa)[0];
    expect(sentBackMail.subject).toBe('Back for rework: Vela four-piston calipers on 330 mm rotors');
    expect(sentBackMail.text).toContain('> Clearance < 3 mm & the "bracket" photo missing');
    expect(sentBackMail.html).toContain('Clearance &lt; 3 mm &amp; the &quot;bracket&quot; photo missing');
    expect(sentBackMail.html).not.toContain('<b>');
    expect(sentBackMail.html).toContain(`${t.config.appUrl}/submissions/${id}/edit`);
    const mine = await rosa.agent.get('/api/me/submissions');
    expect(mine.body.items.find((i: { id: number }) => i.id === id)).toMatchObject({
      status: 'sent_back',
      reviewNote: 'Clearance < 3 mm & the "bracket" photo missing',
    });

    // --- edited and resubmitted
    const edit = await patch(rosa, `/api/submissions/${id}`, {
      data: swapRecord({ summary: 'Now with the clearance measured.' }),
      body: 'Second write-up.',
    });
    expect(edit.status).toBe(200);
    expect(edit.body.status).toBe('sent_back');
    expect((await post(rosa, `/api/submissions/${id}/submit`)).body.status).toBe('in_review');

    // --- approved: public sheet and search index show it
    const indexBefore = await request(server).get('/api/search-index');
    const approved = await post(mo, `/api/review/${id}/approve`, { note: 'Thanks, clear photos.' });
    expect(approved.status).toBe(200);
    expect(approved.body.revision).toMatchObject({ status: 'approved', number: 1 });
    const sheet = await request(server).get(`/api/swaps/${slug}`);
    expect(sheet.status).toBe(200);
    expect(sheet.body.revision).toMatchObject({ number: 1, status: 'approved', body: 'Second write-up.' });
    expect(sheet.body.revision.data.summary).toBe('Now with the clearance measured.');
    expect(sheet.body.revision.photos).toHaveLength(1);
    expect((await request(server).get(sheet.body.revision.photos[0].url)).status).toBe(200);
    const index = await request(server).get('/api/search-index');
    expect(index.headers.etag).not.toBe(indexBefore.headers.etag);
    expect(index.body.documents.map((d: { slug: string }) => d.slug)).toContain(slug);
    expect(outboxTo(rosa)[0].subject).toBe('Published: Vela four-piston calipers on 330 mm rotors');

    // the new caliper joined the catalogue and the approved line points at it
    const row = t.db.select().from(revisions).where(eq(revisions.id, id)).get()!;
    const partId = row.data.parts[0].partId!;
    expect(partId).toBeGreaterThan(0);
    expect(t.db.select().from(parts).where(eq(parts.id, partId)).get()).toMatchObject({
      kind: 'caliper',
      partNumbers: ['OV-355-104-L'],
    });
    expect(row.reviewedById).toBe(mo.id);
    expect(
      t.db
        .select({ a: reviewEvents.action })
        .from(reviewEvents)
        .where(eq(reviewEvents.revisionId, id))
        .all()
        .map((e) => e.a),
    ).toEqual(['submitted', 'sent_back', 'submitted', 'approved']);

    // --- nobody edits an approved revision in place
    const locked = await patch(rosa, `/api/submissions/${id}`, { data: swapRecord({ title: 'Quietly changed afterwards' }) });
    expect(locked.status).toBe(409);
    expect(locked.body.error.message).toMatch(/Published revisions never change/);

    // --- another member proposes a correction: revision 2, while 1 stays public
    const corr = await post(kai, '/api/submissions', {
      swapSlug: slug, changeNote: 'Re-measured on the car; the figures now match the parts.',
      data: swapRecord({ title: 'Vela four-piston calipers on 330 mm rotors, corrected torque' }),
      body: 'Second write-up.\n\nTorque corrected.',
    });
    expect(corr.status).toBe(201);
    expect(corr.body).toMatchObject({
      number: 2,
      status: 'draft',
      isCorrection: true,
      swapSlug: slug, changeNote: 'Re-measured on the car; the figures now match the parts.',
      author: { login: 'camber_kai' },
    });
    // it starts with its own copies of the approved revision's photos
    expect(corr.body.photos).toHaveLength(1);
    expect(corr.body.photos[0].id).not.toBe(sheet.body.revision.photos[0].id);
    expect(await t.storage.exists(corr.body.photos[0].id)).toBe(true);
    expect((await post(kai, '/api/submissions', { swapSlug: slug, changeNote: 'Re-measured on the car; the figures now match the parts.', data: swapRecord() })).status).toBe(409);
    expect((await post(kai, `/api/submissions/${corr.body.id}/submit`)).status).toBe(200);
    const stillOne = await request(server).get(`/api/swaps/${slug}`);
    expect(stillOne.body.revision.number).toBe(1);
    expect(stillOne.body.revision.data.title).toBe('Vela four-piston calipers on 330 mm rotors');

    const detail = (await mo.agent.get(`/api/review/${corr.body.id}`)).body as ReviewDetail;
    expect(detail.canDecide).toBe(true);
    expect(detail.current).toMatchObject({ number: 1, body: 'Second write-up.' });
    expect(detail.current!.data.title).toBe('Vela four-piston calipers on 330 mm rotors');
    expect(detail.revision.isCorrection).toBe(true);
    expect(detail.history.map((h) => [h.action, h.actor.login])).toEqual([['submitted', 'camber_kai']]);
    expect(detail.checks.map((c) => c.id)).toContain('torque');

    const approved2 = await post(mo, `/api/review/${corr.body.id}/approve`, {});
    expect(approved2.status).toBe(200);
    // the approved title changed, so the address follows it; the old one redirects
    const renamed = 'h31-front-vela-four-piston-calipers-on-330-mm-rotors-corrected-torque';
    expect((await request(server).get(`/api/swaps/${slug}`)).headers.location).toBe(`/api/swaps/${renamed}`);
    const sheet2 = await request(server).get(`/api/swaps/${renamed}`);
    expect(sheet2.body.revision).toMatchObject({ number: 2, author: { login: 'camber_kai' } });
    expect(sheet2.body.history.map((h: { number: number; status: string }) => [h.number, h.status])).toEqual([
      [2, 'approved'],
      [1, 'superseded'],
    ]);
    const old = await request(server).get(`/api/swaps/${renamed}/revisions/1`);
    expect(old.status).toBe(200);
    expect(old.body.revision).toMatchObject({ number: 1, status: 'superseded' });
    const index2 = await request(server).get('/api/search-index');
    expect(index2.body.documents.find((d: { slug: string }) => d.slug === renamed).title).toBe(
      'Vela four-piston calipers on 330 mm rotors, corrected torque',
    );

    // the corrector hears it was approved; the original author hears that their swap changed
    expect(outboxTo(kai)[0].subject).toBe('Published: Vela four-piston calipers on 330 mm rotors, corrected torque');
    expect(outboxTo(kai)[0].text).toContain(`/swaps/${renamed}`);
    const toOriginal = outboxTo(rosa)[0];
    expect(toOriginal.subject).toBe('Your swap was updated: Vela four-piston calipers on 330 mm rotors, corrected torque');
    expect(toOriginal.text).toContain('camber kai proposed a correction');
    expect(
      t.db
        .select()
        .from(reviewEvents)
        .where(and(eq(reviewEvents.revisionId, id), eq(reviewEvents.action, 'superseded')))
        .get(),
    ).toBeDefined();
  });
});

describe('who may decide', () => {
  it('when a moderator reviews their own submission, then approve is 403, canDecide is false, and another moderator can approve', async () => {
    const own = await submitted(mo, swapRecord({ title: 'Moderator’s own Vela swap' }));
    const detail = await mo.agent.get(`/api/review/${own.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.canDecide).toBe(false);
    const res = await post(mo, `/api/review/${own.id}/approve`, {});
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/own submission/);
    expect((await post(mo, `/api/review/${own.id}/decline`, { note: 'Declining my own' })).status).toBe(403);
    expect(t.db.select().from(revisions).where(eq(revisions.id, own.id)).get()!.status).toBe('in_review');

    const byAdmin = await post(ada, `/api/review/${own.id}/approve`, {});
    expect(byAdmin.status).toBe(200);
    expect(byAdmin.body.revision.status).toBe('approved');
  });

  it('when a revision is not in review, then every decision is 409', async () => {
    const created = await post(rosa, '/api/submissions', {
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: swapRecord({ title: 'A draft the desk never sees' }),
    });
    // a draft is not on the desk at all
    expect((await post(mo, `/api/review/${created.body.id}/approve`, {})).status).toBe(404);
    const sub = await submitted(rosa);
    expect((await post(mo, `/api/review/${sub.id}/decline`, { note: 'Duplicate of an approved swap' })).status).toBe(200);
    for (const action of ['approve', 'send-back', 'decline']) {
      expect((await post(mo, `/api/review/${sub.id}/${action}`, { note: 'Second decision' })).status).toBe(409);
    }
  });

  it('when declined, then the reason is required, the member is told, and the revision stays locked', async () => {
    const sub = await submitted(rosa, swapRecord({ title: 'A record that will be declined' }));
    const noReason = await post(mo, `/api/review/${sub.id}/decline`, { note: ' ' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.note).toBeDefined();
    const res = await post(mo, `/api/review/${sub.id}/decline`, { note: 'Not a swap: an advert for <i>parts</i>' });
    expect(res.body.revision).toMatchObject({ status: 'declined', reviewNote: 'Not a swap: an advert for parts' });
    const mail = outboxTo(rosa)[0];
    expect(mail.subject).toBe('Not published: A record that will be declined');
    expect(mail.text).toContain('Not a swap: an advert for parts');
    const edit = await patch(rosa, `/api/submissions/${sub.id}`, { data: swapRecord() });
    expect(edit.status).toBe(409);
    expect(edit.body.error.message).toMatch(/was not published/);
  });
});

describe('POST /api/review/bulk-decline', () => {
  it('when several spam submissions are declined at once, then all are declined with one reason; a bad batch changes nothing', async () => {
    const spam = [
      await submitted(kai, swapRecord({ title: 'Cheap parts click here one' })),
      await submitted(kai, swapRecord({ title: 'Cheap parts click here two' })),
    ];
    const own = await submitted(mo, swapRecord({ title: 'Moderator record in the batch' }));
    const bad = await post(mo, '/api/review/bulk-decline', { revisionIds: [spam[0].id, own.id], note: 'Spam' });
    expect(bad.status).toBe(409);
    expect(bad.body.error.fields['revisionIds.1']).toMatch(/your own/);
    expect(t.db.select().from(revisions).where(eq(revisions.id, spam[0].id)).get()!.status).toBe('in_review');

    const mailsBefore = outboxTo(kai).length;
    const res = await post(mo, '/api/review/bulk-decline', { revisionIds: spam.map((s) => s.id), note: 'Spam' });
    expect(res.status).toBe(200);
    expect(res.body.declined).toEqual(spam.map((s) => s.id));
    for (const s of spam) {
      const r = t.db.select().from(revisions).where(eq(revisions.id, s.id)).get()!;
      expect([r.status, r.reviewNote, r.reviewedById]).toEqual(['declined', 'Spam', mo.id]);
      expect(
        t.db
          .select()
          .from(reviewEvents)
          .where(and(eq(reviewEvents.revisionId, s.id), eq(reviewEvents.action, 'declined')))
          .get()!.note,
      ).toBe('Spam');
    }
    expect(outboxTo(kai).length).toBe(mailsBefore + 2);
    expect((await post(kai, '/api/review/bulk-decline', { revisionIds: [own.id], note: 'Spam' })).status).toBe(403);
  });
});

describe('the queue', () => {
  it('lists oldest first and filters by status, chassis and age, with counts', async () => {
    const other = addChassis(t.db, 'halden-h40', { model: 'H40', code: 'H40', yearFrom: 1999, yearTo: 2007 });
    const older = await submitted(paul, swapRecord({ title: 'Queue test, submitted long ago' }));
    const newer = await submitted(paul, swapRecord({ title: 'Queue test, submitted just now' }), { chassisId: other.id });
    t.db
      .update(revisions)
      .set({ submittedAt: new Date(Date.now() - 10 * 86_400_000) })
      .where(eq(revisions.id, older.id))
      .run();

    const all = (await mo.agent.get('/api/review/queue')).body as ReviewQueue;
    const ids = all.items.map((i) => i.revisionId);
    expect(ids.indexOf(older.id)).toBeLessThan(ids.indexOf(newer.id));
    expect(all.items.every((i) => i.status === 'in_review')).toBe(true);
    const inReview = t.db.select().from(revisions).where(eq(revisions.status, 'in_review')).all().length;
    expect(all.counts.in_review).toBe(inReview);
    expect(all.items).toHaveLength(inReview);

    const aged = (await mo.agent.get('/api/review/queue').query({ olderThanDays: 7 })).body as ReviewQueue;
    expect(aged.items.map((i) => i.revisionId)).toEqual([older.id]);
    const byChassis = (await mo.agent.get('/api/review/queue').query({ chassis: 'halden-h40' })).body as ReviewQueue;
    expect(byChassis.items.map((i) => i.revisionId)).toEqual([newer.id]);
    expect(byChassis.items[0].chassis).toEqual({ slug: 'halden-h40', label: 'Halden H40' });

    await post(mo, `/api/review/${newer.id}/send-back`, { note: 'Add a photo please' });
    const sentBack = (await mo.agent.get('/api/review/queue').query({ status: 'sent_back' })).body as ReviewQueue;
    expect(sentBack.items.map((i) => i.revisionId)).toContain(newer.id);
    expect(sentBack.items.every((i) => i.status === 'sent_back')).toBe(true);
    expect(sentBack.counts.sent_back).toBe(sentBack.items.length);
    // no photos on these: the photo check fails
    expect(sentBack.items.find((i) => i.revisionId === newer.id)!.failedChecks).toBeGreaterThanOrEqual(1);
    expect((await mo.agent.get('/api/review/queue').query({ status: 'approved' })).status).toBe(400);
  });
});

describe('approving a new chassis and new parts', () => {
  it('when a revision proposing a chassis is approved, then the chassis joins the catalogue and an existing part number is reused', async () => {
    const data = swapRecord({ title: 'Vela calipers on the Regent front' });
    data.parts = [
      ...data.parts,
      {
        role: 'Caliper bracket',
        kind: 'adapter',
        name: 'Regent radial bracket',
        maker: 'Northgate Fabrication',
        partNumbers: ['NF-TR-VB'],
        cameOn: [],
        quantity: 2,
      },
    ];
    const created = await post(paul, '/api/submissions', {
      newChassis: {
        make: 'Tamsin',
        model: 'Regent',
        code: 'TR',
        yearFrom: 1994,
        lugCount: 5,
        pcdMm: 114.3,
        centreBoreMm: 67.1,
        wheelBoltThread: 'M12x1.5',
      },
      axle: 'front',
      category: 'brakes',
      data,
    });
    expect(created.status).toBe(201);
    await post(paul, `/api/submissions/${created.body.id}/submit`);
    const partsBefore = t.db.select().from(parts).all().length;
    const mailsBefore = t.db.select().from(mailOutbox).all().length;
    expect((await post(mo, `/api/review/${created.body.id}/approve`, {})).status).toBe(200);
    // the member has no e-mail address: the approval sends nothing
    expect(t.db.select().from(mailOutbox).all().length).toBe(mailsBefore);

    const regent = t.db.select().from(chassis).where(eq(chassis.slug, 'tamsin-regent-tr')).get()!;
    expect(regent.proposed).toBe(false);
    expect((await request(server).get('/api/chassis/tamsin-regent-tr')).status).toBe(200);
    const lines = t.db.select().from(revisions).where(eq(revisions.id, created.body.id)).get()!.data.parts;
    // the caliper's part number is already in the catalogue from the lifecycle test; only the bracket is new
    expect(t.db.select().from(parts).all().length).toBe(partsBefore + 1);
    expect(t.db.select().from(parts).where(eq(parts.id, lines[0].partId!)).get()!.partNumbers).toEqual(['OV-355-104-L']);
    expect(t.db.select().from(parts).where(eq(parts.id, lines[1].partId!)).get()).toMatchObject({
      kind: 'adapter',
      name: 'Regent radial bracket',
    });
  });

  it('when an approved swap with the same donor caliper exists, then the duplicate check links it', async () => {
    const sub = await submitted(kai, swapRecord({ title: 'Vela calipers again on the H31' }));
    const detail = (await mo.agent.get(`/api/review/${sub.id}`)).body as ReviewDetail;
    const dup = detail.checks.find((c) => c.id === 'duplicate')!;
    expect(dup.status).toBe('attention');
    expect(dup.link).toMatch(/^\/swaps\/h31-front-vela-four-piston-calipers-on-330-mm-rotors/);
  });
});

describe('reason templates', () => {
  it('moderators create, list, edit and delete them; members cannot', async () => {
    const created = await post(mo, '/api/review/templates', {
      label: 'Torque values',
      text: 'List every fastener with its torque in N·m.',
    });
    expect(created.status).toBe(201);
    expect((await mo.agent.get('/api/review/templates')).body.items).toContainEqual(created.body);
    const edited = await patch(mo, `/api/review/templates/${created.body.id}`, {
      label: 'Torque values',
      text: 'List every fastener you touched with its torque.',
    });
    expect(edited.body.text).toBe('List every fastener you touched with its torque.');
    expect((await post(mo, '/api/review/templates', { label: 'x', text: '' })).status).toBe(400);
    expect((await post(kai, '/api/review/templates', { label: 'Mine', text: 'A member template' })).status).toBe(403);
    expect((await mo.agent.delete(`/api/review/templates/${created.body.id}`).set('x-csrf-token', mo.token)).status).toBe(204);
    expect((await mo.agent.get('/api/review/templates')).body.items.map((i: { id: number }) => i.id)).not.toContain(
      created.body.id,
    );
    expect((await mo.agent.delete(`/api/review/templates/${created.body.id}`).set('x-csrf-token', mo.token)).status).toBe(404);
  });
});

describe('flags', () => {
  it('any member flags a public swap; a moderator resolves it with an outcome and a note and the flagger is told', async () => {
    const slug = t.db
      .select({ slug: swaps.slug })
      .from(swaps)
      .where(eq(swaps.slug, 'h31-front-vela-four-piston-calipers-on-330-mm-rotors-corrected-torque'))
      .get()!.slug;
    expect((await post(kai, `/api/swaps/${slug}/flags`, { kind: 'other', reason: 'bad' })).status).toBe(400);
    const res = await post(kai, `/api/swaps/${slug}/flags`, {
      kind: 'wrong_figure',
      reason: 'The torque for the <b>bracket</b> bolts looks too low & should be checked',
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      swapSlug: slug,
      kind: 'wrong_figure',
      status: 'open',
      reporter: { login: 'camber_kai' },
      reason: 'The torque for the bracket bolts looks too low & should be checked',
    });
    const queue = (await mo.agent.get('/api/review/queue')).body as ReviewQueue;
    expect(queue.flags.map((f) => f.id)).toContain(res.body.id);
    expect(queue.counts.flags).toBe(queue.flags.length);

    const draftOnly = await post(rosa, '/api/submissions', {
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: swapRecord({ title: 'Never public, cannot be flagged' }),
    });
    expect((await post(kai, `/api/swaps/${draftOnly.body.swapSlug}/flags`, { kind: 'other', reason: 'Flagging a draft' })).status).toBe(404);

    expect(
      (await post(kai, `/api/review/flags/${res.body.id}/resolve`, { outcome: 'not_a_problem', note: 'Resolving my own' })).status,
    ).toBe(403);
    const noOutcome = await post(mo, `/api/review/flags/${res.body.id}/resolve`, {});
    expect(noOutcome.status).toBe(400);
    expect(noOutcome.body.error.fields.outcome).toBeTruthy();
    const resolved = await post(mo, `/api/review/flags/${res.body.id}/resolve`, {
      outcome: 'not_a_problem',
      note: 'Checked with the bracket maker: 110 N·m is right.',
    });
    expect(resolved.status).toBe(200);
    expect(resolved.body).toMatchObject({
      status: 'resolved',
      outcome: 'not_a_problem',
      resolutionNote: 'Checked with the bracket maker: 110 N·m is right.',
    });
    expect(t.db.select().from(flags).where(eq(flags.id, res.body.id)).get()!.resolvedById).toBe(mo.id);
    const mail = outboxTo(kai)[0];
    expect(mail.subject).toMatch(/^Your flag on “.+”: Not a problem$/);
    expect(mail.html).toContain('looks too low &amp; should be checked');
    expect(mail.text).toContain('110 N·m is right.');
    expect((await post(mo, `/api/review/flags/${res.body.id}/resolve`, { outcome: 'spam', note: 'Again' })).status).toBe(409);
    expect(((await mo.agent.get('/api/review/queue')).body as ReviewQueue).flags.map((f) => f.id)).not.toContain(res.body.id);
  });
});

describe('GET /api/outbox', () => {
  it('when moderators and admins read it, then it is newest first with each delivery state; members get 403, visitors 401', async () => {
    const res = await mo.agent.get('/api/outbox');
    expect(res.status).toBe(200);
    expect(res.body.delivering).toBe(false);
    const ids = res.body.items.map((m: { id: number }) => m.id);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    expect(res.body.items[0]).toEqual(
      expect.objectContaining({
        recipient: expect.any(String),
        subject: expect.any(String),
        text: expect.any(String),
        html: expect.any(String),
        status: 'kept',
        sentAt: null,
      }),
    );
    expect((await ada.agent.get('/api/outbox')).status).toBe(200);
    expect((await kai.agent.get('/api/outbox')).status).toBe(403);
    expect((await request(server).get('/api/outbox')).status).toBe(401);
  });

  it('when a moderator reads it, then they see which member a message went to but never an address; an admin sees the address', async () => {
    const asModerator = (await mo.agent.get('/api/outbox')).body.items as OutboxMessage[];
    const asAdmin = (await ada.agent.get('/api/outbox')).body.items as OutboxMessage[];
    expect(asModerator.length).toBeGreaterThan(0);
    expect(asModerator.map((m) => m.recipient)).toEqual(asAdmin.map((m) => m.recipient));
    expect(JSON.stringify(asModerator)).not.toContain('@members.swapyard.invalid');
    expect(asModerator.every((m) => m.to === null && m.delivery === null)).toBe(true);
    expect(asAdmin.every((m) => m.to === `${m.recipient}@members.swapyard.invalid`)).toBe(true);
    expect(asAdmin[0].delivery).toEqual(expect.objectContaining({ attempts: 0, lastError: null }));
  });
});

describe('decision logs', () => {
  it('every decision is logged with who, what and which revision, and without the member-facing note', async () => {
    const lines: Record<string, unknown>[] = [];
    const sink = new Writable({
      write(chunk, _enc, done) {
        for (const line of String(chunk).split('\n').filter(Boolean)) lines.push(JSON.parse(line));
        done();
      },
    });
    // a second app on the same database, whose logger the test can read
    const logged = createApp({
      db: t.db,
      mailer: t.mailer,
      storage: t.storage,
      clock: { now: () => new Date() },
      config: t.config,
      logger: pino({ level: 'info' }, sink),
    });
    const l = listen(logged);
    try {
      const sub = await submitted(rosa, swapRecord({ title: 'A record whose decision is logged' }));
      const a = l.agent();
      await signIn(a, 'gauge_mo');
      const token = await csrfToken(a);
      expect(
        (
          await a
            .post(`/api/review/${sub.id}/send-back`)
            .set('x-csrf-token', token)
            .send({ note: 'Secret reason text\n{"event":"forged"}' })
        ).status,
      ).toBe(200);
      const decision = lines.find((x) => x.event === 'review_decision');
      expect(decision).toMatchObject({ revisionId: sub.id, action: 'sent_back', actorId: mo.id });
      expect(decision!.time).toBeDefined();
      expect(JSON.stringify(lines)).not.toContain('Secret reason text');
      expect(lines.some((x) => x.event === 'forged')).toBe(false);
    } finally {
      l.server.close();
    }
  });
});
