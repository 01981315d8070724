import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { type Agent, type Member, addUser, csrfToken, listen, signIn, signedInMember } from './support/auth-helpers';
import { addChassis, addPart, swapRecord } from './support/swap-fixtures';
import { chassis, mailOutbox, reviewEvents, revisions, swaps } from '../../server/db/schema/index';
import type { SubmissionView } from '../../shared/schemas/submissions';

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;

const members: Record<string, Member> = {};

async function member(login: string, role: 'member' | 'moderator' = 'member'): Promise<Member> {
  return (members[login] = await signedInMember(t.db, agent, login, role));
}

const post = (m: Member, path: string, body?: object) => m.agent.post(path).set('x-csrf-token', m.token).send(body);
const patch = (m: Member, path: string, body: object) => m.agent.patch(path).set('x-csrf-token', m.token).send(body);

let drafts = 0;
/** the record's own title the first time, then numbered: a member's open drafts never share a title */
const nextRecord = () => swapRecord(drafts++ === 0 ? {} : { title: `${swapRecord().title}, draft ${drafts}` });

async function draft(m: Member, extra: object = {}): Promise<SubmissionView> {
  const res = await post(m, '/api/submissions', {
    chassisId,
    axle: 'front',
    category: 'brakes',
    data: nextRecord(),
    body: 'Fitted over a weekend.',
    ...extra,
  });
  expect(res.status).toBe(201);
  return res.body;
}

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  await member('rivet_rosa');
  await member('camber_kai');
  await member('gauge_mo', 'moderator');
});
afterAll(() => {
  server.close();
  t.close();
});

describe('POST /api/submissions', () => {
  it('when a member saves a new swap, then it is revision 1 as a draft, readable by them and not public', async () => {
    const rosa = members.rivet_rosa;
    const created = await draft(rosa);
    expect(created).toMatchObject({
      number: 1,
      status: 'draft',
      isCorrection: false,
      axle: 'front',
      category: 'brakes',
      editable: true,
      submittedAt: null,
    });
    expect(created.swapSlug).toBe('h31-front-vela-four-piston-calipers-on-330-mm-rotors');
    expect(created.chassis.slug).toBe('halden-h31');
    expect(created.author.login).toBe('rivet_rosa');
    expect(created.data.parts[0].partNumbers).toEqual(['OV-355-104-L']);

    const again = await rosa.agent.get(`/api/submissions/${created.id}`);
    expect(again.status).toBe(200);
    expect(again.body.data).toEqual(created.data);
    expect((await request(server).get(`/api/swaps/${created.swapSlug}`)).status).toBe(404);

    // the same title again (another member's) gets its own slug
    const second = await draft(members.camber_kai, { data: swapRecord() });
    expect(second.swapSlug).toBe(`${created.swapSlug}-2`);
  });

  it('when a field is wrong, then the 400 names it by its path and nothing is stored', async () => {
    const before = t.db.select().from(revisions).all().length;
    const bad = swapRecord();
    bad.parts = [{ ...bad.parts[0], name: '' }];
    const res = await post(members.rivet_rosa, '/api/submissions', { chassisId, axle: 'front', category: 'brakes', data: bad });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid');
    expect(res.body.error.fields['data.parts.0.name']).toBe('Name the part');

    const noChassis = await post(members.rivet_rosa, '/api/submissions', { data: swapRecord() });
    expect(noChassis.status).toBe(400);
    expect(Object.keys(noChassis.body.error.fields).sort()).toEqual(['axle', 'category', 'chassisId']);

    const unknownPart = swapRecord();
    unknownPart.parts = [{ ...unknownPart.parts[0], partId: 9999 }];
    const res3 = await post(members.rivet_rosa, '/api/submissions', {
      chassisId,
      axle: 'front',
      category: 'brakes',
      data: unknownPart,
    });
    expect(res3.status).toBe(400);
    expect(res3.body.error.fields['data.parts.0.partId']).toMatch(/not in the catalogue/);

    const res4 = await post(members.rivet_rosa, '/api/submissions', {
      chassisId: 9999,
      axle: 'front',
      category: 'brakes',
      data: swapRecord(),
    });
    expect(res4.status).toBe(400);
    expect(res4.body.error.fields.chassisId).toBeDefined();
    expect(t.db.select().from(revisions).all().length).toBe(before);
  });

  it('when the write-up and notes carry HTML, then it is stored stripped and the text is kept', async () => {
    const data = swapRecord({
      title: 'Vela calipers, notes with markup',
      summary: 'Bracket from <b>Lathe & Lug</b><script>alert(1)</script>',
    });
    data.parts = [{ ...data.parts[0], notes: '<img src=x onerror="alert(1)">Bleed nipple up' }];
    const body =
      'Intro <script>alert("x")</script>\n\n<a href="javascript:alert(1)" onclick="alert(2)">link</a> and a < b\n\n<iframe src="https://example.invalid"></iframe>done';
    const created = await draft(members.rivet_rosa, { data, body });
    const stored = t.db.select().from(revisions).where(eq(revisions.id, created.id)).get()!;
    expect(stored.body).toBe('Intro \n\nlink and a < b\n\ndone');
    expect(stored.data.summary).toBe('Bracket from Lathe & Lug');
    expect(stored.data.parts[0].notes).toBe('Bleed nipple up');
    expect(JSON.stringify(stored)).not.toMatch(/<script|onerror|javascript:|<iframe/i);
  });

  it('when a member proposes a new chassis, then it is stored as proposed and stays out of the catalogue list', async () => {
    const created = await draft(members.camber_kai, {
      chassisId: undefined,
      newChassis: {
        make: 'Tamsin',
        model: 'Regent',
        code: 'TR2',
        yearFrom: 1994,
        yearTo: 2002,
        lugCount: 5,
        pcdMm: 114.3,
        centreBoreMm: 67.1,
        wheelBoltThread: 'M12x1.5',
      },
    });
    expect(created.chassis.slug).toBe('tamsin-regent-tr2');
    const row = t.db.select().from(chassis).where(eq(chassis.slug, 'tamsin-regent-tr2')).get()!;
    expect(row.proposed).toBe(true);
    expect(created.swapSlug.startsWith('tr2-front-')).toBe(true);
    const list = await request(server).get('/api/chassis');
    expect(list.body.items.map((c: { slug: string }) => c.slug)).not.toContain('tamsin-regent-tr2');

    // both at once is refused
    const both = await post(members.camber_kai, '/api/submissions', {
      chassisId,
      newChassis: {
        make: 'Tamsin',
        model: 'Regent',
        code: 'TR2',
        yearFrom: 1994,
        lugCount: 5,
        pcdMm: 114.3,
        centreBoreMm: 67.1,
        wheelBoltThread: 'M12x1.5',
      },
      axle: 'front',
      category: 'brakes',
      data: swapRecord(),
    });
    expect(both.status).toBe(400);
    expect(both.body.error.fields.chassisId).toMatch(/not both/);
  });

  it('when signed out or without the CSRF token, then nothing is created', async () => {
    const before = t.db.select().from(swaps).all().length;
    expect(
      (await request(server).post('/api/submissions').send({ chassisId, axle: 'front', category: 'brakes', data: swapRecord() }))
        .status,
    ).toBe(401);
    const noToken = await members.rivet_rosa.agent
      .post('/api/submissions')
      .send({ chassisId, axle: 'front', category: 'brakes', data: swapRecord() });
    expect(noToken.status).toBe(403);
    expect(noToken.body.error.code).toBe('csrf');
    expect((await request(server).get('/api/me/submissions')).status).toBe(401);
    expect(t.db.select().from(swaps).all().length).toBe(before);
  });
});

describe('PATCH /api/submissions/:id (autosave)', () => {
  it('when the author saves again, then the whole record is replaced and the swap fields follow', async () => {
    const rosa = members.rivet_rosa;
    const created = await draft(rosa);
    const res = await patch(rosa, `/api/submissions/${created.id}`, {
      axle: 'rear',
      data: swapRecord({ title: 'Vela calipers, second thoughts', costs: [] }),
      body: 'Longer write-up.',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ axle: 'rear', body: 'Longer write-up.', swapSlug: created.swapSlug });
    expect(res.body.data.title).toBe('Vela calipers, second thoughts');
    expect(res.body.data.costs).toEqual([]);
    const read = await rosa.agent.get(`/api/submissions/${created.id}`);
    expect(read.body.data.title).toBe('Vela calipers, second thoughts');
  });

  it('when the save is invalid, then it is a 400 with the field and the saved draft is unchanged', async () => {
    const rosa = members.rivet_rosa;
    const created = await draft(rosa);
    const res = await patch(rosa, `/api/submissions/${created.id}`, { data: { ...swapRecord(), title: 'short' }, body: 'lost?' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['data.title']).toBe('A title of at least 8 characters');
    expect((await rosa.agent.get(`/api/submissions/${created.id}`)).body.body).toBe('Fitted over a weekend.');
  });

  it('when someone else tries, then another member and a moderator both get 404 for a draft, and nothing changes', async () => {
    const created = await draft(members.rivet_rosa);
    const other = await patch(members.camber_kai, `/api/submissions/${created.id}`, {
      data: swapRecord({ title: 'Taken over by someone else' }),
    });
    expect(other.status).toBe(404);
    expect((await members.camber_kai.agent.get(`/api/submissions/${created.id}`)).status).toBe(404);
    const mod = await patch(members.gauge_mo, `/api/submissions/${created.id}`, {
      data: swapRecord({ title: 'Edited by the moderator' }),
    });
    // a never-submitted draft is private to its author, even from the review desk
    expect(mod.status).toBe(404);
    expect((await members.gauge_mo.agent.get(`/api/submissions/${created.id}`)).status).toBe(404);
    expect(t.db.select().from(revisions).where(eq(revisions.id, created.id)).get()!.data.title).toBe(created.data.title);
  });
});

describe('POST /api/submissions/:id/submit and the lock', () => {
  it('when the author submits, then it is in review, locked, recorded and the author is told', async () => {
    const rosa = members.rivet_rosa;
    const created = await draft(rosa);
    const res = await post(rosa, `/api/submissions/${created.id}/submit`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'in_review', editable: false });
    expect(Date.parse(res.body.submittedAt)).toBeGreaterThan(Date.now() - 60_000);
    const events = t.db.select().from(reviewEvents).where(eq(reviewEvents.revisionId, created.id)).all();
    expect(events.map((e) => [e.action, e.actorId])).toEqual([['submitted', rosa.id]]);
    const mail = t.db.select().from(mailOutbox).all().at(-1)!;
    expect(mail.to).toBe('rivet_rosa@members.swapyard.invalid');
    expect(mail.subject).toBe(`At the review desk: ${created.data.title}`);

    const edit = await patch(rosa, `/api/submissions/${created.id}`, { data: swapRecord({ title: 'Changed while in review' }) });
    expect(edit.status).toBe(409);
    expect(edit.body.error.message).toMatch(/at the review desk and locked/);
    expect((await post(rosa, `/api/submissions/${created.id}/submit`)).status).toBe(409);
    const del = await rosa.agent.delete(`/api/submissions/${created.id}`).set('x-csrf-token', rosa.token);
    expect(del.status).toBe(409);
    expect(t.db.select().from(revisions).where(eq(revisions.id, created.id)).get()!.data.title).toBe(created.data.title);
  });

  it('when another member tries to submit someone’s draft, then it is refused and stays a draft', async () => {
    const created = await draft(members.rivet_rosa);
    expect((await post(members.camber_kai, `/api/submissions/${created.id}/submit`)).status).toBe(404);
    expect((await post(members.gauge_mo, `/api/submissions/${created.id}/submit`)).status).toBe(404);
    expect(t.db.select().from(revisions).where(eq(revisions.id, created.id)).get()!.status).toBe('draft');
  });
});

describe('DELETE /api/submissions/:id', () => {
  it('when the author deletes a new swap’s draft, then the revision, the swap and its proposed chassis go', async () => {
    const kai = members.camber_kai;
    const created = await draft(kai, {
      chassisId: undefined,
      newChassis: {
        make: 'Halden',
        model: 'H20',
        code: 'H20',
        yearFrom: 1984,
        lugCount: 4,
        pcdMm: 100,
        centreBoreMm: 57.1,
        wheelBoltThread: 'M12x1.5',
      },
    });
    const res = await kai.agent.delete(`/api/submissions/${created.id}`).set('x-csrf-token', kai.token);
    expect(res.status).toBe(204);
    expect(t.db.select().from(revisions).where(eq(revisions.id, created.id)).get()).toBeUndefined();
    expect(t.db.select().from(swaps).where(eq(swaps.id, created.swapId)).get()).toBeUndefined();
    expect(t.db.select().from(chassis).where(eq(chassis.slug, 'halden-h20')).get()).toBeUndefined();
    expect((await kai.agent.get(`/api/submissions/${created.id}`)).status).toBe(404);
  });
});

describe('GET /api/me/submissions', () => {
  it('lists only the member’s own revisions, newest change first, with status and title', async () => {
    const fresh = await member('pistonpaul');
    const a = await draft(fresh, { data: swapRecord({ title: 'First of the two records' }) });
    const b = await draft(fresh, { data: swapRecord({ title: 'Second of the two records' }) });
    await post(fresh, `/api/submissions/${a.id}/submit`);
    const res = await fresh.agent.get('/api/me/submissions');
    expect(res.status).toBe(200);
    expect(res.body.items.map((i: { id: number; status: string; title: string }) => [i.id, i.status, i.title])).toEqual([
      [a.id, 'in_review', 'First of the two records'],
      [b.id, 'draft', 'Second of the two records'],
    ]);
    expect(res.body.items[0]).toMatchObject({ swapSlug: a.swapSlug, number: 1, reviewNote: null });
  });
});

describe('corrections', () => {
  it('when the swap has no approved revision, then a correction is 404', async () => {
    const created = await draft(members.rivet_rosa);
    const res = await post(members.camber_kai, '/api/submissions', { swapSlug: created.swapSlug, changeNote: 'Re-measured on the car; the figures now match the parts.', data: swapRecord() });
    expect(res.status).toBe(404);
  });

  it('when a catalogue part is referenced, then its id is kept on the line', async () => {
    const part = addPart(t.db, 'orsino-vela-front-caliper-left-sub');
    const data = swapRecord({ title: 'Vela calipers from the catalogue' });
    data.parts = [{ ...data.parts[0], partId: part.id }];
    const created = await draft(members.rivet_rosa, { data });
    expect(created.data.parts[0].partId).toBe(part.id);
  });
});

describe('rate limit', () => {
  it('when a member creates more submissions in an hour than allowed, then the next is 429 and nothing is stored', async () => {
    const limited = await makeTestApp({ SUBMISSION_RATE_LIMIT: '2' });
    const l = listen(limited.app);
    try {
      const id = addChassis(limited.db).id;
      addUser(limited.db, 'rivet_rosa');
      const a = l.agent();
      await signIn(a, 'rivet_rosa');
      const token = await csrfToken(a);
      let n = 0;
      const send = () =>
        a
          .post('/api/submissions')
          .set('x-csrf-token', token)
          .send({ chassisId: id, axle: 'front', category: 'brakes', data: swapRecord({ title: `Vela calipers, try ${++n}` }) });
      expect((await send()).status).toBe(201);
      expect((await send()).status).toBe(201);
      const third = await send();
      expect(third.status).toBe(429);
      expect(third.body.error.code).toBe('rate_limited');
      expect(limited.db.select().from(swaps).all()).toHaveLength(2);
      // autosave is not counted
      const first = limited.db.select().from(revisions).all()[0];
      expect(
        (
          await a
            .patch(`/api/submissions/${first.id}`)
            .set('x-csrf-token', token)
            .send({ data: { ...swapRecord(), title: first.data.title }, body: 'saved' })
        ).status,
      ).toBe(200);
    } finally {
      l.server.close();
      limited.close();
    }
  });
});
