import type { Server } from 'node:http';
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, createDraft, listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis, swapRecord } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { fittedReports, revisionPhotos, revisions } from '../../server/db/schema/index';
import { processPhoto } from '../../server/features/photos/photo-processing';

// One account could add about 1.8 GB of photos an hour. Each member now has a storage quota for the
// photos they keep unpublished (drafts, sent back, in review) and on fitted reports.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let rosa: Member;
let kai: Member;

const QUOTA_MB = 2;

/** Random pixels barely compress, so each re-encoded photo is several hundred KB. */
function noisyPhoto(seed: number): Promise<Buffer> {
  const width = 1400;
  const height = 1000;
  const raw = crypto.createHash('sha256').update(String(seed)).digest();
  const pixels = Buffer.alloc(width * height * 3);
  for (let i = 0; i < pixels.length; i++) pixels[i] = raw[i % 32]! ^ ((i * 2654435761) >>> 24);
  return sharp(pixels, { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 95 })
    .toBuffer();
}

beforeAll(async () => {
  t = await makeTestApp({ STORAGE_QUOTA_MB: String(QUOTA_MB), UPLOAD_RATE_LIMIT: '1000', SUBMISSION_RATE_LIMIT: '1000' });
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  kai = await signedInMember(t.db, agent, 'camber_kai');
});
afterAll(() => {
  server.close();
  t.close();
});

const upload = (m: Member, id: number, photo: Buffer) =>
  m.agent.post(`/api/submissions/${id}/photos`).set('x-csrf-token', m.token).attach('photos', photo, 'p.jpg');
const storage = async (m: Member) => (await m.agent.get('/api/me/storage')).body as { usedBytes: number; quotaBytes: number };

let drafts = 0;
/** a record with a title of its own: a member's open drafts never share one */
const record = () => swapRecord({ title: `Vela calipers on the H31, draft ${++drafts}` });

/** Uploads photos to new drafts until one is refused; returns the refusal and the bytes stored before it. */
async function fillToQuota(m: Member, seed: number) {
  let used = 0;
  for (let i = 0; i < 20; i++) {
    const draft = await createDraft(m, chassisId, record());
    const res = await upload(m, draft, await noisyPhoto(seed + i));
    if (res.status !== 201) return { refused: res, used };
    used += t.db.select().from(revisionPhotos).where(eq(revisionPhotos.fileId, res.body.photos[0].id)).get()!.bytes;
    expect((await storage(m)).usedBytes).toBe(used);
  }
  throw new Error('the quota was never reached');
}

describe('per-member storage quota', () => {
  it('when a member’s unpublished photos reach the quota, then the next upload is refused with the figures and nothing is stored', async () => {
    const start = await storage(rosa);
    expect(start).toEqual({ usedBytes: 0, quotaBytes: QUOTA_MB * 1024 * 1024 });
    const { refused, used } = await fillToQuota(rosa, 0);
    expect(refused.status).toBe(413);
    expect(refused.body.error.code).toBe('storage_quota');
    expect(refused.body.error.fields.photos).toMatch(/of your 2 MB/);
    expect(used).toBeLessThanOrEqual(QUOTA_MB * 1024 * 1024);
    const files = (await t.storage.list()).length;
    const rows = t.db.select().from(revisionPhotos).all().length;
    const again = await upload(rosa, await createDraft(rosa, chassisId, record()), await noisyPhoto(99));
    expect(again.status).toBe(413);
    expect((await t.storage.list()).length).toBe(files);
    expect(t.db.select().from(revisionPhotos).all().length).toBe(rows);
    // another member is not affected
    expect((await upload(kai, await createDraft(kai, chassisId, record()), await noisyPhoto(100))).status).toBe(201);
  });

  it('when the member deletes a draft’s photo, then the space is theirs again', async () => {
    const before = await storage(rosa);
    const withPhoto = t.db
      .select({ fileId: revisionPhotos.fileId, revisionId: revisionPhotos.revisionId, bytes: revisionPhotos.bytes })
      .from(revisionPhotos)
      .innerJoin(revisions, eq(revisions.id, revisionPhotos.revisionId))
      .where(eq(revisions.authorId, rosa.id))
      .get()!;
    const del = await rosa.agent
      .delete(`/api/submissions/${withPhoto.revisionId}/photos/${withPhoto.fileId}`)
      .set('x-csrf-token', rosa.token);
    expect(del.status).toBe(200);
    expect((await storage(rosa)).usedBytes).toBe(before.usedBytes - withPhoto.bytes);
  });

  it('when photos are published, or copied from a published revision into a correction, then they do not count', async () => {
    const member = await signedInMember(t.db, agent, 'pistonpaul');
    const swap = addSwap(t.db, { slug: 'h31-published', chassisId, authorId: member.id, revisions: [{ status: 'approved' }] });
    const p = await processPhoto(await noisyPhoto(7));
    await t.storage.put('publishedphotoxxxxx1', p.full);
    t.db
      .insert(revisionPhotos)
      .values({
        revisionId: swap.revisionIds[0]!,
        fileId: 'publishedphotoxxxxx1',
        width: p.width,
        height: p.height,
        bytes: p.full.length,
        sha256: p.sha256,
        createdAt: new Date(),
      })
      .run();
    expect((await storage(member)).usedBytes).toBe(0);
    const correction = await member.agent
      .post('/api/submissions')
      .set('x-csrf-token', member.token)
      .send({ swapSlug: swap.slug, changeNote: 'Re-measured on the car; the figures now match the parts.', data: swapRecord({ title: 'A correction of my own swap' }) });
    expect(correction.status).toBe(201);
    expect(correction.body.photos).toHaveLength(1);
    expect((await storage(member)).usedBytes).toBe(0);
  });

  it('when a fitted-report photo would pass the quota, then the report is refused and nothing is stored', async () => {
    const owner = addUser(t.db, 'ada_owner').id;
    const swap = addSwap(t.db, { slug: 'h31-report-quota', chassisId, authorId: owner, revisions: [{ status: 'approved' }] });
    const lathe = await signedInMember(t.db, agent, 'lathe_lou');
    await fillToQuota(lathe, 300);
    const res = await lathe.agent
      .post(`/api/swaps/${swap.slug}/fitted-reports`)
      .set('x-csrf-token', lathe.token)
      .field('diameterIn', '16')
      .field('widthIn', '7')
      .field('offsetMm', '38')
      .attach('photo', await noisyPhoto(200), 'wheel.jpg');
    expect(res.status).toBe(413);
    expect(res.body.error.fields.photo).toMatch(/of your 2 MB/);
    expect(t.db.select().from(fittedReports).where(eq(fittedReports.swapId, swap.swapId)).all()).toHaveLength(0);
  });
});
