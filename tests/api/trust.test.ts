import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, earnTrust } from './support/swap-rows';
import { fittedReports, swaps } from '../../server/db/schema/index';
import { trustLevelOf } from '../../server/features/trust/member-trust';
import { TRUSTED } from '../../shared/trust';
import type { FittedReportsView, ModerationReportList } from '../../shared/schemas/fitted-reports';

// Trust in fitted reports: a new member's report (and its photo) waits for a moderator, is neither public
// nor counted until one lets it go live; a member who has earned trust reports straight to the sheet.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let rosa: Member;
let newbie: Member;
let trusted: Member;
let mo: Member;
let png: Buffer;
const swapSlugs: string[] = [];

beforeAll(async () => {
  t = await makeTestApp();
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  newbie = await signedInMember(t.db, agent, 'fresh_fern');
  trusted = await signedInMember(t.db, agent, 'camber_kai');
  earnTrust(t.db, trusted.id, chassisId);
  mo = await signedInMember(t.db, agent, 'gauge_mo', 'moderator');
  for (let i = 1; i <= 5; i++)
    swapSlugs.push(
      addSwap(t.db, { slug: `h31-trust-${i}`, chassisId, authorId: rosa.id, revisions: [{ status: 'approved' }] }).slug,
    );
  png = await sharp({ create: { width: 120, height: 90, channels: 3, background: '#1d4d3a' } })
    .png()
    .toBuffer();
});
afterAll(() => {
  server.close();
  t.close();
});

const report = (m: Member, slug: string, fields: Record<string, string> = {}, photo = true) => {
  let req = m.agent
    .post(`/api/swaps/${slug}/fitted-reports`)
    .set('x-csrf-token', m.token)
    .field('diameterIn', '16')
    .field('widthIn', '7')
    .field('offsetMm', '38')
    .field('note', 'Fits with the stock wheel');
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return photo ? req.attach('photo', png, { filename: 'wheel.png', contentType: 'image/png' }) : req;
};
const publicList = async (slug: string) =>
  (await request(server).get(`/api/swaps/${slug}/fitted-reports`)).body as FittedReportsView;
const fittedCount = (slug: string) => t.db.select({ n: swaps.fittedCount }).from(swaps).where(eq(swaps.slug, slug)).get()!.n;
const post = (m: Member, url: string) => m.agent.post(url).set('x-csrf-token', m.token).send({});
const levelOf = (m: Member) => trustLevelOf(t.db, { id: m.id, role: 'member' });

describe('a new member’s fitted report is held for a moderator', () => {
  it('when a new member reports, then only they and moderators see it, it is not counted, and its photo is not public', async () => {
    const slug = swapSlugs[0]!;
    expect(levelOf(newbie)).toBe('new');
    const res = await report(newbie, slug, { clearanceMm: '4.5' });
    expect(res.status).toBe(201);
    const mine = (res.body as FittedReportsView).mine!;
    expect(mine).toMatchObject({ state: 'held', hidden: false, clearanceMm: 4.5, evidence: 'measured_with_photo' });

    const seen = await publicList(slug);
    expect(seen.count).toBe(0);
    expect(seen.reports).toEqual([]);
    expect(seen.verification).toMatchObject({ fittedBy: 0, withPhotos: 0, strongest: null });
    expect(fittedCount(slug)).toBe(0);
    expect((await request(server).get(`/api/swaps/${slug}`)).body.swap.fittedCount).toBe(0);

    // the photo: a visitor gets 404, its member and a moderator get it privately
    expect((await request(server).get(mine.photo!.url)).status).toBe(404);
    const own = await newbie.agent.get(mine.photo!.url);
    expect(own.status).toBe(200);
    expect(own.headers['cache-control']).toMatch(/private/);
    expect((await mo.agent.get(mine.photo!.url)).status).toBe(200);

    const modView = (await mo.agent.get(`/api/swaps/${slug}/fitted-reports`)).body as FittedReportsView;
    expect(modView.reports.map((r) => [r.member.login, r.state])).toEqual([['fresh_fern', 'held']]);
    expect(modView.count).toBe(0);
  });

  it('when moderators list held reports, then the report is there with the member’s trust level; members may not list them', async () => {
    const list = (await mo.agent.get('/api/fitted-reports?show=held')).body as ModerationReportList;
    expect(list.show).toBe('held');
    expect(list.counts.held).toBe(1);
    expect(list.items).toHaveLength(1);
    expect(list.items[0]).toMatchObject({
      swap: { slug: swapSlugs[0] },
      member: { login: 'fresh_fern' },
      memberTrust: 'new',
      state: 'held',
      evidence: 'measured_with_photo',
    });
    expect((await newbie.agent.get('/api/fitted-reports?show=held')).status).toBe(403);
    expect((await request(server).get('/api/fitted-reports?show=held')).status).toBe(401);
    expect((await mo.agent.get('/api/fitted-reports?show=everything')).status).toBe(400);
  });

  it('when a moderator lets it go live, then it shows, counts, its photo is public, and it cannot be released twice', async () => {
    const slug = swapSlugs[0]!;
    const id = t.db.select().from(fittedReports).where(eq(fittedReports.userId, newbie.id)).get()!.id;
    expect((await post(newbie, `/api/fitted-reports/${id}/release`)).status).toBe(403);
    const res = await post(mo, `/api/fitted-reports/${id}/release`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ id, state: 'live' });
    const seen = await publicList(slug);
    expect(seen.count).toBe(1);
    expect(seen.verification).toMatchObject({ fittedBy: 1, withPhotos: 1, strongest: 'measured_with_photo' });
    expect(fittedCount(slug)).toBe(1);
    expect((await request(server).get(seen.reports[0]!.photo!.url)).status).toBe(200);
    expect((await post(mo, `/api/fitted-reports/${id}/release`)).status).toBe(409);
    expect(((await mo.agent.get('/api/fitted-reports?show=held')).body as ModerationReportList).counts.held).toBe(0);
  });

  it('when a member still new edits a live report, then it waits for a moderator again', async () => {
    const slug = swapSlugs[0]!;
    const res = await newbie.agent
      .patch(`/api/swaps/${slug}/fitted-reports/mine`)
      .set('x-csrf-token', newbie.token)
      .send({ note: 'Changed my mind about the note' });
    expect(res.status).toBe(200);
    expect(res.body.mine.state).toBe('held');
    expect((await publicList(slug)).count).toBe(0);
    expect(fittedCount(slug)).toBe(0);
  });
});

describe('trust earned', () => {
  it('when a member has an approved revision, then their report goes live at once and counts', async () => {
    const slug = swapSlugs[1]!;
    expect(levelOf(trusted)).toBe('trusted');
    const res = await report(trusted, slug, {}, false);
    expect(res.status).toBe(201);
    expect(res.body.mine).toMatchObject({ state: 'live', evidence: 'word', clearanceMm: null });
    expect((await publicList(slug)).count).toBe(1);
    expect(fittedCount(slug)).toBe(1);
  });

  it('when a new member’s reports are let stand up to the threshold, then their next report goes live; hidden ones do not count', async () => {
    const grower = await signedInMember(t.db, agent, 'lugnut_lee');
    const ids: number[] = [];
    for (const slug of swapSlugs.slice(1, 1 + TRUSTED.standingReports)) {
      const res = await report(grower, slug, {}, false);
      expect(res.body.mine.state).toBe('held');
      ids.push(res.body.mine.id as number);
    }
    for (const id of ids) expect((await post(mo, `/api/fitted-reports/${id}/release`)).status).toBe(200);
    expect(levelOf(grower)).toBe('trusted');
    // a hidden report stops counting toward trust
    expect((await post(mo, `/api/fitted-reports/${ids[0]}/hide`)).status).toBe(200);
    expect(levelOf(grower)).toBe('new');
    expect((await post(mo, `/api/fitted-reports/${ids[0]}/unhide`)).status).toBe(200);
    expect(levelOf(grower)).toBe('trusted');
    const next = await report(grower, swapSlugs[4]!, {}, false);
    expect(next.status).toBe(201);
    expect(next.body.mine.state).toBe('live');
  });
});

describe('hide, restore and see hidden reports', () => {
  it('when a moderator hides a live report, then readers lose it, the hidden list has it, and restoring brings it back', async () => {
    const slug = swapSlugs[1]!;
    const before = (await publicList(slug)).count;
    const id = t.db.select().from(fittedReports).where(eq(fittedReports.userId, trusted.id)).get()!.id;
    expect((await post(mo, `/api/fitted-reports/${id}/hide`)).status).toBe(200);
    expect((await publicList(slug)).count).toBe(before - 1);
    expect(fittedCount(slug)).toBe(before - 1);
    const hidden = (await mo.agent.get('/api/fitted-reports?show=hidden')).body as ModerationReportList;
    expect(hidden.items.map((r) => [r.id, r.hidden, r.member.login])).toEqual([[id, true, 'camber_kai']]);
    // the member still sees it as theirs, marked
    expect(((await trusted.agent.get(`/api/swaps/${slug}/fitted-reports`)).body as FittedReportsView).mine).toMatchObject({
      id,
      hidden: true,
    });
    expect((await post(mo, `/api/fitted-reports/${id}/unhide`)).status).toBe(200);
    expect((await publicList(slug)).count).toBe(before);
    expect(((await mo.agent.get('/api/fitted-reports?show=hidden')).body as ModerationReportList).items).toEqual([]);
  });
});

describe('evidence behind a report', () => {
  it('when the clearance is out of range, then it is 400 naming the field and nothing is stored', async () => {
    const m = await signedInMember(t.db, agent, 'pistonpaul');
    const res = await report(m, swapSlugs[2]!, { clearanceMm: '75' }, false);
    expect(res.status).toBe(400);
    expect(res.body.error.fields.clearanceMm).toMatch(/Between 0 and 50 mm/);
    expect(t.db.select().from(fittedReports).where(eq(fittedReports.userId, m.id)).all()).toEqual([]);
  });

  it('when reports carry different evidence, then the sheet counts each kind and names the strongest', async () => {
    const slug = swapSlugs[3]!;
    const members = await Promise.all(['tread_tom', 'hub_hana', 'bore_ben'].map((l) => signedInMember(t.db, agent, l)));
    for (const m of members) earnTrust(t.db, m.id, chassisId);
    expect((await report(members[0]!, slug, { clearanceMm: '3' }, false)).body.mine.evidence).toBe('measured');
    expect((await report(members[1]!, slug)).body.mine.evidence).toBe('photo');
    expect((await report(members[2]!, slug, {}, false)).body.mine.evidence).toBe('word');
    const v = (await publicList(slug)).verification;
    expect(v.byEvidence).toMatchObject({ measured_with_photo: 0, measured: 1, photo: 1 });
    expect(v.strongest).toBe('measured');
  });
});
