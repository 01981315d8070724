import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { makeTestApp, type TestApp } from './support/test-app';
import { addShop, listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, earnTrust } from './support/swap-rows';
import { fittedReports, reportHides, revisionPhotos, shopLinks, swaps } from '../../server/db/schema/index';
import { processPhoto } from '../../server/features/photos/photo-processing';
import type { FittedReportsView } from '../../shared/schemas/fitted-reports';
import { eq } from 'drizzle-orm';
import { cacheDirectives, expectYearLong } from './support/cache-headers';

// Moderation that sticks: hiding a fitted report is a record about the member and the swap, not a flag
// on one row, so deleting and re-creating the report does not bring it back.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let authorId: number;
let kai: Member;
let mo: Member;
let rosa: Member;
let shopId: number;
let png: Buffer;

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  authorId = rosa.id;
  shopId = addShop(t.db, 'ridgeway-performance', 'Ridgeway Performance').id;
  kai = await signedInMember(t.db, agent, 'camber_kai');
  // a member with an approved revision: their reports go live without waiting for a moderator
  earnTrust(t.db, kai.id, chassisId);
  mo = await signedInMember(t.db, agent, 'gauge_mo', 'moderator');
  png = await sharp({ create: { width: 200, height: 150, channels: 3, background: '#b8892f' } })
    .png()
    .toBuffer();
});
afterAll(() => {
  server.close();
  t.close();
});

const report = (m: Member, slug: string, note = 'Fits with 3 mm to spare') =>
  m.agent
    .post(`/api/swaps/${slug}/fitted-reports`)
    .set('x-csrf-token', m.token)
    .field('diameterIn', '16')
    .field('widthIn', '7')
    .field('offsetMm', '38')
    .field('note', note)
    .attach('photo', png, { filename: 'wheel.png', contentType: 'image/png' });
const publicList = async (slug: string) =>
  (await request(server).get(`/api/swaps/${slug}/fitted-reports`)).body as FittedReportsView;

describe('hiding a fitted report', () => {
  it('when the member deletes a hidden report and reports again, then the new report is hidden too and its photo is not public', async () => {
    const swap = addSwap(t.db, { slug: 'h31-hidden-again', chassisId, authorId, revisions: [{ status: 'approved' }] });
    const first = await report(kai, swap.slug, 'Abusive text');
    expect(first.status).toBe(201);
    const id = first.body.mine.id as number;
    expect((await mo.agent.post(`/api/fitted-reports/${id}/hide`).set('x-csrf-token', mo.token)).status).toBe(200);
    expect((await publicList(swap.slug)).count).toBe(0);

    expect((await kai.agent.delete(`/api/swaps/${swap.slug}/fitted-reports/mine`).set('x-csrf-token', kai.token)).status).toBe(
      204,
    );
    expect(
      t.db
        .select()
        .from(reportHides)
        .all()
        .filter((h) => h.swapId === swap.swapId && h.liftedAt === null),
    ).toHaveLength(1);

    const again = await report(kai, swap.slug, 'Same abuse, new report');
    expect(again.status).toBe(201);
    expect(again.body.mine.hidden).toBe(true);
    const list = await publicList(swap.slug);
    expect(list.count).toBe(0);
    expect(list.reports).toEqual([]);
    expect(t.db.select().from(swaps).where(eq(swaps.id, swap.swapId)).get()!.fittedCount).toBe(0);
    const photo = again.body.mine.photo.url as string;
    expect((await request(server).get(photo)).status).toBe(404);
    const own = await kai.agent.get(photo);
    expect(own.status).toBe(200);
    expect(own.headers['cache-control']).toBe('private, no-store');
  });

  it('when a moderator lifts the hide, then the report shows and a later report by the member is public from the start', async () => {
    const swap = addSwap(t.db, { slug: 'h31-lifted', chassisId, authorId, revisions: [{ status: 'approved' }] });
    const first = await report(kai, swap.slug);
    const id = first.body.mine.id as number;
    await mo.agent.post(`/api/fitted-reports/${id}/hide`).set('x-csrf-token', mo.token);
    const lifted = await mo.agent.post(`/api/fitted-reports/${id}/unhide`).set('x-csrf-token', mo.token);
    expect(lifted.status).toBe(200);
    expect((await publicList(swap.slug)).count).toBe(1);
    const records = t.db
      .select()
      .from(reportHides)
      .all()
      .filter((h) => h.swapId === swap.swapId);
    expect(records).toHaveLength(1);
    expect(records[0]!.hiddenById).toBe(mo.id);
    expect(records[0]!.liftedById).toBe(mo.id);
    await kai.agent.delete(`/api/swaps/${swap.slug}/fitted-reports/mine`).set('x-csrf-token', kai.token);
    const again = await report(kai, swap.slug);
    expect(again.body.mine.hidden).toBe(false);
    expect((await publicList(swap.slug)).count).toBe(1);
  });

  it('when a hide is recorded, then it is about this member on this swap only', async () => {
    const a = addSwap(t.db, { slug: 'h31-hide-a', chassisId, authorId, revisions: [{ status: 'approved' }] });
    const b = addSwap(t.db, { slug: 'h31-hide-b', chassisId, authorId, revisions: [{ status: 'approved' }] });
    const onA = await report(kai, a.slug);
    await mo.agent.post(`/api/fitted-reports/${onA.body.mine.id}/hide`).set('x-csrf-token', mo.token);
    const onB = await report(kai, b.slug);
    expect(onB.body.mine.hidden).toBe(false);
    expect(t.db.select().from(fittedReports).where(eq(fittedReports.swapId, b.swapId)).get()!.hiddenAt).toBeNull();
  });
});

describe('taking down a revision’s photo or write-up', () => {
  async function publishedWithPhoto(slug: string) {
    const swap = addSwap(t.db, {
      slug,
      chassisId,
      authorId,
      revisions: [
        { status: 'superseded', body: 'Old write-up naming the previous owner and his address' },
        { status: 'approved', body: 'Current write-up' },
      ],
    });
    const p = await processPhoto(png);
    const ids = [`${slug.replace(/-/g, '')}aaaaaaaaaaaa`.slice(0, 24), `${slug.replace(/-/g, '')}bbbbbbbbbbbb`.slice(0, 24)];
    // the same photo on both revisions, as a correction's copy carries it forward
    for (const [i, revisionId] of swap.revisionIds.entries()) {
      await t.storage.put(ids[i]!, p.full);
      t.db
        .insert(revisionPhotos)
        .values({
          revisionId,
          fileId: ids[i]!,
          width: p.width,
          height: p.height,
          bytes: p.full.length,
          sha256: p.sha256,
          createdAt: new Date(),
        })
        .run();
    }
    // a shop pinned the old revision
    const linkCode = `rp-${slug.slice(-10)}`;
    t.db
      .insert(shopLinks)
      .values({
        code: linkCode,
        shopId: shopId,
        swapId: swap.swapId,
        revisionId: swap.revisionIds[0]!,
        createdById: authorId,
        createdAt: new Date(),
        updatedAt: new Date(),
      })
      .run();
    return { ...swap, photoIds: ids, linkCode };
  }

  it('when a moderator takes down a photo of a superseded revision, then no reader gets it, nor its copy in the current revision; an admin can restore it', async () => {
    const swap = await publishedWithPhoto('h31-takedown-photo');
    const ada = await signedInMember(t.db, agent, 'ada_admin', 'admin');
    const [oldId, copyId] = swap.photoIds;
    const fresh = await request(server).get(`/media/${oldId}`);
    // a browser keeps it; a shared cache asks again after five minutes and gets a 304 while the photo stands
    expectYearLong(fresh);
    expect(cacheDirectives(fresh.headers['cache-control'])['s-maxage']).toBe(300);
    expect((await request(server).get(`/media/${oldId}`).set('if-none-match', fresh.headers.etag)).status).toBe(304);

    expect(
      (
        await kai.agent
          .post(`/api/review/revisions/${swap.revisionIds[0]}/takedowns`)
          .set('x-csrf-token', kai.token)
          .send({ target: 'photo', photoId: oldId, reason: 'Shows a number plate' })
      ).status,
    ).toBe(403);
    const down = await mo.agent
      .post(`/api/review/revisions/${swap.revisionIds[0]}/takedowns`)
      .set('x-csrf-token', mo.token)
      .send({ target: 'photo', photoId: oldId, reason: 'Shows a number plate' });
    expect(down.status).toBe(201);
    expect(down.body).toMatchObject({ target: 'photo', reason: 'Shows a number plate', revertedAt: null });
    expect(down.body.createdBy.login).toBe('gauge_mo');

    for (const id of [oldId, copyId]) {
      const gone = await request(server).get(`/media/${id}`);
      expect(gone.status).toBe(410);
      expect(gone.headers['cache-control']).toBe('no-store');
      expect((await kai.agent.get(`/media/${id}?size=thumb`)).status).toBe(410);
      for (const m of [mo, rosa]) {
        const private_ = await m.agent.get(`/media/${id}`);
        expect(private_.status).toBe(200);
        expect(private_.headers['cache-control']).toBe('private, no-store');
      }
    }
    const old = await request(server).get(`/api/swaps/${swap.slug}/revisions/1`);
    expect(old.body.revision.photos).toEqual([]);
    expect((await request(server).get(`/api/swaps/${swap.slug}`)).body.revision.photos).toEqual([]);
    const cards = (await request(server).get('/api/swaps?limit=50')).body.items as { slug: string; photo?: unknown }[];
    expect(JSON.stringify(cards.filter((c) => c.slug === swap.slug))).not.toMatch(new RegExp(`${oldId}|${copyId}`));
    expect(JSON.stringify((await request(server).get(`/api/l/${swap.linkCode}`)).body)).not.toMatch(
      new RegExp(`${oldId}|${copyId}`),
    );
    // the review page of the revision that carries the copy shows the takedown too, so it can be put back from there
    const desk = await mo.agent.get(`/api/review/${swap.revisionIds[1]}`);
    expect(desk.body.takedowns.map((x: { id: number }) => x.id)).toEqual([down.body.id]);
    expect(desk.body.revision.photos[0].takenDown).toBe(true);
    // taking it down twice is one takedown
    const again = await mo.agent
      .post(`/api/review/revisions/${swap.revisionIds[0]}/takedowns`)
      .set('x-csrf-token', mo.token)
      .send({ target: 'photo', photoId: oldId, reason: 'Again' });
    expect(again.status).toBe(409);

    const list = await mo.agent.get('/api/review/takedowns');
    expect(list.body.items.map((x: { id: number }) => x.id)).toContain(down.body.id);
    expect((await mo.agent.post(`/api/review/takedowns/${down.body.id}/revert`).set('x-csrf-token', mo.token)).status).toBe(403);
    const reverted = await ada.agent.post(`/api/review/takedowns/${down.body.id}/revert`).set('x-csrf-token', ada.token);
    expect(reverted.status).toBe(200);
    expect(reverted.body.revertedBy.login).toBe('ada_admin');
    expect((await request(server).get(`/media/${oldId}`)).status).toBe(200);
    expect((await request(server).get(`/api/swaps/${swap.slug}/revisions/1`)).body.revision.photos).toHaveLength(1);
    expect((await request(server).get(`/api/swaps/${swap.slug}`)).body.revision.photos).toHaveLength(1);
    // the record keeps both decisions
    const record = (await mo.agent.get('/api/review/takedowns')).body.items.find((x: { id: number }) => x.id === down.body.id);
    expect(record).toMatchObject({
      reason: 'Shows a number plate',
      createdBy: { login: 'gauge_mo' },
      revertedBy: { login: 'ada_admin' },
    });
  });

  it('when a moderator takes down the write-up of a revision, then readers get the record without it and are told why it is missing', async () => {
    const swap = await publishedWithPhoto('h31-takedown-text');
    const before = await request(server).get(`/api/swaps/${swap.slug}/revisions/1`);
    const down = await mo.agent
      .post(`/api/review/revisions/${swap.revisionIds[0]}/takedowns`)
      .set('x-csrf-token', mo.token)
      .send({ target: 'body', reason: 'Personal details of a third party' });
    expect(down.status).toBe(201);
    const after = await request(server).get(`/api/swaps/${swap.slug}/revisions/1`).set('if-none-match', before.headers.etag);
    expect(after.status).toBe(200);
    expect(after.body.revision.body).toBe('');
    expect(after.body.revision.bodyTakenDown).toBe(true);
    expect(JSON.stringify(after.body)).not.toContain('previous owner');
    expect(after.body.revision.data.title).toBe(before.body.revision.data.title);
    const pinned = await request(server).get(`/api/l/${swap.linkCode}`);
    expect(pinned.body.sheet.revision).toMatchObject({ number: 1, body: '', bodyTakenDown: true });
    expect(JSON.stringify(pinned.body)).not.toContain('previous owner');
    // the current revision keeps its own write-up
    expect((await request(server).get(`/api/swaps/${swap.slug}`)).body.revision.body).toBe('Current write-up');
  });

  it('when the revision is not published, then there is nothing to take down', async () => {
    const swap = addSwap(t.db, { slug: 'h31-takedown-review', chassisId, authorId, revisions: [{ status: 'in_review' }] });
    const res = await mo.agent
      .post(`/api/review/revisions/${swap.revisionIds[0]}/takedowns`)
      .set('x-csrf-token', mo.token)
      .send({ target: 'body', reason: 'Not public anyway' });
    expect(res.status).toBe(409);
  });

  it('when a report is hidden, then its photo was never cacheable for long', async () => {
    const swap = addSwap(t.db, { slug: 'h31-report-cache', chassisId, authorId, revisions: [{ status: 'approved' }] });
    const created = await report(kai, swap.slug);
    const url = created.body.mine.photo.url as string;
    const first = await request(server).get(url);
    expect(cacheDirectives(first.headers['cache-control'])['s-maxage']).toBe(300);
    await mo.agent.post(`/api/fitted-reports/${created.body.mine.id}/hide`).set('x-csrf-token', mo.token);
    expect((await request(server).get(url)).status).toBe(404);
  });
});
