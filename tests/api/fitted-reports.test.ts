import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, csrfToken, listen, signIn, type Agent } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, earnTrust } from './support/swap-rows';
import { fittedReports, swaps } from '../../server/db/schema/index';
import type { FittedReportsView } from '../../shared/schemas/fitted-reports';
import type { SearchIndexResponse } from '../../shared/search/search-document';

let t: TestApp;
let server: Server;
let agent: () => Agent;
const signedIn = new Map<string, { a: Agent; token: string }>();
let swapId: number;

const wheel = { diameterIn: 16, widthIn: 7, offsetMm: 38, spacerMm: 10, note: 'Cleared with 3 mm to spare at the barrel.' };

async function as(login: string) {
  if (!signedIn.has(login)) {
    const a = agent();
    await signIn(a, login);
    signedIn.set(login, { a, token: await csrfToken(a) });
  }
  return signedIn.get(login)!;
}

const fittedCount = (id = swapId) => t.db.select({ n: swaps.fittedCount }).from(swaps).where(eq(swaps.id, id)).get()!.n;
const indexCount = async (slug: string) => {
  const res = await request(server).get('/api/search-index');
  expect(res.status).toBe(200);
  return (res.body as SearchIndexResponse).documents.find((d) => d.slug === slug)?.fittedCount;
};
const png = (w = 64, h = 48) =>
  sharp({ create: { width: w, height: h, channels: 3, background: { r: 29, g: 77, b: 58 } } })
    .png()
    .toBuffer();

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  const author = addUser(t.db, 'rivet_rosa');
  addUser(t.db, 'gauge_mo', 'moderator');
  const h31 = addChassis(t.db);
  // members with an approved revision each: their reports go live at once (tests/api/trust.test.ts holds the rest)
  for (const login of ['camber_kai', 'pistonpaul', 'lugnut_lee']) earnTrust(t.db, addUser(t.db, login).id, h31.id);
  swapId = addSwap(t.db, {
    slug: 'h31-front-vela',
    chassisId: h31.id,
    authorId: author.id,
    revisions: [{ status: 'superseded' }, { status: 'approved' }],
  }).swapId;
  addSwap(t.db, { slug: 'h31-front-draft', chassisId: h31.id, authorId: author.id, revisions: [{ status: 'in_review' }] });
});
afterAll(() => {
  server.close();
  t.close();
});

describe('POST /api/swaps/:slug/fitted-reports', () => {
  it('when signed out, then it is 401 and nothing is stored', async () => {
    const anonymous = agent();
    const token = await csrfToken(anonymous);
    const res = await anonymous.post('/api/swaps/h31-front-vela/fitted-reports').set('x-csrf-token', token).send(wheel);
    expect(res.status).toBe(401);
    expect(t.db.select().from(fittedReports).all()).toHaveLength(0);
  });

  it('when a member reports, then the sheet count, the swap row and the search index all say 1', async () => {
    const { a, token } = await as('camber_kai');
    expect(await indexCount('h31-front-vela')).toBe(0);
    const res = await a.post('/api/swaps/h31-front-vela/fitted-reports').set('x-csrf-token', token).send(wheel);
    expect(res.status).toBe(201);
    const view = res.body as FittedReportsView;
    expect(view.count).toBe(1);
    expect(view.mine).toMatchObject({
      revisionNumber: 2,
      wheel: { diameterIn: 16, widthIn: 7, offsetMm: 38, spacerMm: 10 },
      note: wheel.note,
      hidden: false,
    });
    expect(fittedCount()).toBe(1);
    expect(await indexCount('h31-front-vela')).toBe(1);

    const list = await request(server).get('/api/swaps/h31-front-vela/fitted-reports');
    expect(list.status).toBe(200);
    expect(list.body.count).toBe(1);
    expect(list.body.reports[0].member.login).toBe('camber_kai');
    expect(list.body.wheels).toEqual([{ wheel: { diameterIn: 16, widthIn: 7, offsetMm: 38, spacerMm: 10 }, members: 1 }]);
    expect(list.body.verification).toEqual({
      reviewed: true,
      fittedBy: 1,
      withPhotos: 0,
      byEvidence: { measured_with_photo: 0, measured: 0, photo: 0, word: 1 },
      strongest: 'word',
    });
    expect(list.body.cannotReport).toBe('signed_out');
    expect((await request(server).get('/api/swaps/h31-front-vela')).body.swap.fittedCount).toBe(1);
  });

  it('when the same member reports the same swap again, then it is 409 and the count stays 1', async () => {
    const { a, token } = await as('camber_kai');
    const res = await a
      .post('/api/swaps/h31-front-vela/fitted-reports')
      .set('x-csrf-token', token)
      .send({ ...wheel, offsetMm: 45 });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(fittedCount()).toBe(1);
    const mine = t.db.select().from(fittedReports).all();
    expect(mine).toHaveLength(1);
    expect(mine[0]!.wheel.offsetMm).toBe(38);
  });

  it('when the swap’s author reports their own swap, then it is 403 and nothing is stored', async () => {
    const { a, token } = await as('rivet_rosa');
    const res = await a.post('/api/swaps/h31-front-vela/fitted-reports').set('x-csrf-token', token).send(wheel);
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/You wrote this swap/);
    expect(fittedCount()).toBe(1);
    expect((await a.get('/api/swaps/h31-front-vela/fitted-reports')).body.cannotReport).toBe('author');
  });

  it('when the swap is not approved yet, then it is 404', async () => {
    const { a, token } = await as('pistonpaul');
    const res = await a.post('/api/swaps/h31-front-draft/fitted-reports').set('x-csrf-token', token).send(wheel);
    expect(res.status).toBe(404);
  });

  it('when the wheel is out of range or missing, then it is 400 with a reason per field', async () => {
    const { a, token } = await as('pistonpaul');
    const res = await a
      .post('/api/swaps/h31-front-vela/fitted-reports')
      .set('x-csrf-token', token)
      .send({ diameterIn: 30, offsetMm: 'wide' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({
      diameterIn: 'Between 10 and 24 in',
      widthIn: 'Enter the wheel width',
      offsetMm: 'Enter the offset (ET)',
    });
    expect(fittedCount()).toBe(1);
  });

  it('when the member names a revision they followed, then a superseded one is accepted and an unknown one is refused', async () => {
    const { a, token } = await as('pistonpaul');
    const bad = await a
      .post('/api/swaps/h31-front-vela/fitted-reports')
      .set('x-csrf-token', token)
      .send({ ...wheel, revisionNumber: 7 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.revisionNumber).toMatch(/Revision 7/);
    const ok = await a
      .post('/api/swaps/h31-front-vela/fitted-reports')
      .set('x-csrf-token', token)
      .send({ ...wheel, revisionNumber: 1, note: '<b>Old</b> sheet, <script>x()</script>same result' });
    expect(ok.status).toBe(201);
    expect(ok.body.mine.revisionNumber).toBe(1);
    expect(ok.body.mine.note).toBe('Old sheet, same result');
    expect(ok.body.count).toBe(2);
    expect(await indexCount('h31-front-vela')).toBe(2);
  });
});

describe('photos on fitted reports', () => {
  it('when a member sends a photo, then it is re-encoded, served, and counted under "with photos"', async () => {
    const { a, token } = await as('lugnut_lee');
    const res = await a
      .post('/api/swaps/h31-front-vela/fitted-reports')
      .set('x-csrf-token', token)
      .field('diameterIn', '17')
      .field('widthIn', '7.5')
      .field('offsetMm', '35')
      .field('spacerMm', '')
      .attach('photo', await png(), { filename: 'wheel.png', contentType: 'image/png' });
    expect(res.status).toBe(201);
    expect(res.body.mine.wheel).toEqual({ diameterIn: 17, widthIn: 7.5, offsetMm: 35, spacerMm: 0 });
    expect(res.body.mine.photo.url).toMatch(/^\/media\/[a-z0-9]+$/);
    expect(res.body.verification.withPhotos).toBe(1);
    const media = await request(server).get(res.body.mine.photo.url);
    expect(media.status).toBe(200);
    expect(media.headers['content-type']).toBe('image/webp');
    expect((await request(server).get(res.body.mine.photo.thumbUrl)).status).toBe(200);
  });

  it('when the "photo" is not an image, then it is 415 and no report is stored', async () => {
    const { a, token } = await as('gauge_mo');
    const res = await a
      .post('/api/swaps/h31-front-vela/fitted-reports')
      .set('x-csrf-token', token)
      .field('diameterIn', '16')
      .field('widthIn', '7')
      .field('offsetMm', '38')
      .attach('photo', Buffer.from('%PDF-1.4 not a photo'), { filename: 'wheel.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(415);
    expect(res.body.error.fields.photo).toMatch(/JPEG, PNG and WebP/);
    expect((await a.get('/api/swaps/h31-front-vela/fitted-reports')).body.mine).toBeNull();
  });
});

describe('editing, removing and hiding', () => {
  it('when a member edits their report, then only what they sent changes', async () => {
    const { a, token } = await as('camber_kai');
    const res = await a.patch('/api/swaps/h31-front-vela/fitted-reports/mine').set('x-csrf-token', token).send({ offsetMm: 42 });
    expect(res.status).toBe(200);
    expect(res.body.mine.wheel).toEqual({ diameterIn: 16, widthIn: 7, offsetMm: 42, spacerMm: 10 });
    expect(res.body.mine.note).toBe(wheel.note);
    const bad = await a.patch('/api/swaps/h31-front-vela/fitted-reports/mine').set('x-csrf-token', token).send({ widthIn: 40 });
    expect(bad.status).toBe(400);
    expect(t.db.select().from(fittedReports).where(eq(fittedReports.id, res.body.mine.id)).get()!.wheel.widthIn).toBe(7);
  });

  it('when a member without a report edits "mine", then it is 404', async () => {
    const { a, token } = await as('rivet_rosa');
    expect(
      (await a.patch('/api/swaps/h31-front-vela/fitted-reports/mine').set('x-csrf-token', token).send({ offsetMm: 40 })).status,
    ).toBe(404);
  });

  it('when a moderator hides a report, then the count drops everywhere, its photo is no longer public, and a member cannot hide', async () => {
    const list = (await request(server).get('/api/swaps/h31-front-vela/fitted-reports')).body as FittedReportsView;
    const withPhoto = list.reports.find((r) => r.member.login === 'lugnut_lee')!;
    const member = await as('pistonpaul');
    expect((await member.a.post(`/api/fitted-reports/${withPhoto.id}/hide`).set('x-csrf-token', member.token)).status).toBe(403);

    const mod = await as('gauge_mo');
    const res = await mod.a.post(`/api/fitted-reports/${withPhoto.id}/hide`).set('x-csrf-token', mod.token);
    expect(res.status).toBe(200);
    expect(fittedCount()).toBe(2);
    expect(await indexCount('h31-front-vela')).toBe(2);
    const after = (await request(server).get('/api/swaps/h31-front-vela/fitted-reports')).body as FittedReportsView;
    expect(after.count).toBe(2);
    expect(after.reports.map((r) => r.member.login)).not.toContain('lugnut_lee');
    expect(after.verification.withPhotos).toBe(0);
    expect((await request(server).get(withPhoto.photo!.url)).status).toBe(404);
    // the member still sees their own report, marked hidden, and its photo
    const owner = await as('lugnut_lee');
    const own = (await owner.a.get('/api/swaps/h31-front-vela/fitted-reports')).body as FittedReportsView;
    expect(own.mine?.hidden).toBe(true);
    expect((await owner.a.get(withPhoto.photo!.url)).status).toBe(200);
    // moderators see hidden reports, marked
    const modView = (await mod.a.get('/api/swaps/h31-front-vela/fitted-reports')).body as FittedReportsView;
    expect(modView.canModerate).toBe(true);
    expect(modView.reports.find((r) => r.id === withPhoto.id)?.hidden).toBe(true);
  });

  it('when a member removes their report, then the count drops and they may report again', async () => {
    const { a, token } = await as('camber_kai');
    const del = await a.delete('/api/swaps/h31-front-vela/fitted-reports/mine').set('x-csrf-token', token);
    expect(del.status).toBe(204);
    expect(fittedCount()).toBe(1);
    expect(await indexCount('h31-front-vela')).toBe(1);
    const again = await a.post('/api/swaps/h31-front-vela/fitted-reports').set('x-csrf-token', token).send(wheel);
    expect(again.status).toBe(201);
    expect(fittedCount()).toBe(2);
  });
});
