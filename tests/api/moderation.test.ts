import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { fittedReports, reportHides, swaps } from '../../server/db/schema/index';
import type { FittedReportsView } from '../../shared/schemas/fitted-reports';
import { eq } from 'drizzle-orm';

// Moderation that sticks: hiding a fitted report is a record about the member and the swap, not a flag
// on one row, so deleting and re-creating the report does not bring it back.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let authorId: number;
let kai: Member;
let mo: Member;
let png: Buffer;

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  authorId = addUser(t.db, 'rivet_rosa').id;
  kai = await signedInMember(t.db, agent, 'camber_kai');
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
