import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import crypto from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, count } from 'drizzle-orm';
import { openDb, migrateDb, closeDb, type Db } from '../../server/db/client';
import { seedDemo, isDatabaseEmpty, countRows, type SeedCounts } from '../../server/db/seed';
import { createDiskStorage, type Storage } from '../../server/storage/disk-storage';
import { thumbId } from '../../server/features/photos/photo-files';
import * as t from '../../server/db/schema/index';
import { swapDataSchema } from '../../shared/schemas/swap-data';

const contentDir = path.resolve(import.meta.dirname, '../../content');
const clock = { now: () => new Date('2026-12-01T12:00:00Z') };

let dir: string;
let db: Db;
let storage: Storage;

beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-seed-'));
  db = openDb(path.join(dir, 'seed.db'));
  migrateDb(db);
  storage = createDiskStorage(path.join(dir, 'uploads'));
});

afterAll(() => {
  closeDb(db);
  fs.rmSync(dir, { recursive: true, force: true });
});

const revisionsWithStatus = (status: (typeof t.revisions.$inferSelect)['status']) =>
  db.select({ n: count() }).from(t.revisions).where(eq(t.revisions.status, status)).get()!.n;

/** Every row of the seeded tables, ids included, to compare two states exactly. */
function snapshot() {
  return {
    users: db.select().from(t.users).all(),
    swaps: db.select().from(t.swaps).all(),
    revisions: db.select().from(t.revisions).all(),
    photos: db.select().from(t.revisionPhotos).all(),
    events: db.select().from(t.reviewEvents).all(),
    fitted: db.select().from(t.fittedReports).all(),
  };
}

describe('demo seed', () => {
  let firstCounts: SeedCounts;

  it('when the database is empty, then it loads the whole demo scenario', async () => {
    expect(isDatabaseEmpty(db)).toBe(true);
    const result = await seedDemo(db, { storage, clock }, {});
    expect(result.seeded).toBe(true);
    firstCounts = result.counts;
    expect(result.counts).toEqual(countRows(db));
    expect(isDatabaseEmpty(db)).toBe(false);

    expect(result.counts.chassis).toBeGreaterThanOrEqual(3);
    expect(result.counts.parts).toBeGreaterThanOrEqual(15);
    expect(result.counts.shops).toBe(2);
    expect(result.counts.users).toBe(6);
    const roles = db
      .select({ role: t.users.role })
      .from(t.users)
      .all()
      .map((u) => u.role);
    expect(new Set(roles)).toEqual(new Set(['member', 'shop', 'moderator', 'admin']));

    const approvedSwaps = db
      .select({ n: count() })
      .from(t.swaps)
      .innerJoin(t.revisions, eq(t.revisions.id, t.swaps.currentRevisionId))
      .where(eq(t.revisions.status, 'approved'))
      .get()!.n;
    expect(approvedSwaps).toBeGreaterThanOrEqual(8);
    expect(revisionsWithStatus('in_review')).toBe(2);
    expect(revisionsWithStatus('sent_back')).toBe(1);
    expect(revisionsWithStatus('superseded')).toBeGreaterThanOrEqual(1);
    expect(result.counts.reviewReasonTemplates).toBeGreaterThanOrEqual(2);
    expect(result.counts.cars).toBeGreaterThanOrEqual(1);
  });

  it('signs in demo members through the provider id demo-<login>, and links the shop account to its shop', () => {
    for (const u of db.select().from(t.users).all()) {
      expect(u.provider).toBe('github');
      expect(u.providerId).toBe(`demo-${u.login}`);
      expect(u.email).toMatch(/@example\.com$/);
    }
    const shopUser = db.select().from(t.users).where(eq(t.users.login, 'ridgeway_shop')).get()!;
    const shop = db.select().from(t.shops).where(eq(t.shops.id, shopUser.shopId!)).get()!;
    expect(shop.slug).toBe('ridgeway-performance');
  });

  it('points every swap at its latest approved revision, or at none when nothing is approved yet', () => {
    const swaps = db.select().from(t.swaps).all();
    for (const swap of swaps) {
      const revs = db.select().from(t.revisions).where(eq(t.revisions.swapId, swap.id)).all();
      const approved = revs.filter((r) => r.status === 'approved');
      expect(approved.length).toBeLessThanOrEqual(1);
      expect(swap.currentRevisionId).toBe(approved[0]?.id ?? null);
      expect(revs.map((r) => r.number).sort()).toEqual(revs.map((_, i) => i + 1));
      const fitted = db.select({ n: count() }).from(t.fittedReports).where(eq(t.fittedReports.swapId, swap.id)).get()!.n;
      expect(swap.fittedCount).toBe(fitted);
    }
    const flagship = swaps.find((s) => s.slug === 'h31-front-vela-four-piston-330')!;
    const history = db.select().from(t.revisions).where(eq(t.revisions.swapId, flagship.id)).all();
    expect(history.map((r) => [r.number, r.status])).toEqual([
      [1, 'superseded'],
      [2, 'approved'],
    ]);
    const superseded = db.select().from(t.reviewEvents).where(eq(t.reviewEvents.revisionId, history[0].id)).all();
    expect(superseded.map((e) => e.action)).toEqual(['submitted', 'approved', 'superseded']);
  });

  it('keeps the review trail: reviewer and date on every decision, reasons on the sent-back one', () => {
    for (const rev of db.select().from(t.revisions).all()) {
      const events = db.select().from(t.reviewEvents).where(eq(t.reviewEvents.revisionId, rev.id)).all();
      expect(events.filter((e) => e.action === 'submitted')).toHaveLength(rev.submittedAt ? 1 : 0);
      if (rev.status === 'in_review') expect(rev.reviewedById).toBeNull();
      if (['approved', 'superseded', 'sent_back'].includes(rev.status)) {
        expect(rev.reviewedById).not.toBeNull();
        expect(rev.reviewedById).not.toBe(rev.authorId);
        expect(rev.reviewedAt!.getTime()).toBeGreaterThanOrEqual(rev.submittedAt!.getTime());
      }
      if (rev.status === 'sent_back') {
        expect(rev.reviewNote).toMatch(/torque/i);
        expect(events.find((e) => e.action === 'sent_back')?.note).toBe(rev.reviewNote);
      }
    }
  });

  it('stores revision data that parses with the swap schema and refers to real catalogue parts', () => {
    const partIds = new Set(
      db
        .select({ id: t.parts.id })
        .from(t.parts)
        .all()
        .map((p) => p.id),
    );
    const revs = db.select().from(t.revisions).all();
    expect(revs.length).toBeGreaterThan(0);
    for (const rev of revs) {
      const parsed = swapDataSchema.safeParse(rev.data);
      expect(parsed.success, `revision ${rev.id}: ${parsed.error?.message}`).toBe(true);
      for (const line of rev.data.parts) if (line.partId !== undefined) expect(partIds.has(line.partId)).toBe(true);
    }
    const flagship = revs.find(
      (r) =>
        r.data.title.startsWith('Orsino Vela four-piston front calipers and 330 mm rotors on the Halden H31') &&
        r.status === 'approved',
    )!;
    const vela = db.select().from(t.parts).where(eq(t.parts.slug, 'orsino-vela-front-caliper-left')).get()!;
    const line = flagship.data.parts.find((p) => p.partId === vela.id)!;
    expect(line.partNumbers).toEqual(['OV-355-104-L']);
    expect(line.cameOn).toEqual(vela.cameOn);
    expect(flagship.data.wheel!.testedWheels.some((w) => w.diameterIn === 15 && w.radialClearanceMm! < 0)).toBe(true);
    expect(flagship.data.wheel!.testedWheels.some((w) => w.diameterIn === 16 && w.radialClearanceMm! >= 3)).toBe(true);
    expect(new Set(flagship.data.costs.map((c) => c.route))).toEqual(new Set(['as_built', 'budget', 'new_kit']));
  });

  it('stores each photo like an upload (WebP plus thumbnail) with its real size, dimensions and hash', async () => {
    const photos = db.select().from(t.revisionPhotos).all();
    expect(photos.length).toBeGreaterThan(0);
    for (const photo of photos) {
      const buffer = await storage.read(photo.fileId);
      expect(buffer.length).toBe(photo.bytes);
      expect(crypto.createHash('sha256').update(buffer).digest('hex')).toBe(photo.sha256);
      const meta = await sharp(buffer).metadata();
      expect(meta.format).toBe('webp');
      expect([meta.width, meta.height]).toEqual([photo.width, photo.height]);
      const thumb = await sharp(await storage.read(thumbId(photo.fileId))).metadata();
      expect(thumb.format).toBe('webp');
      expect(Math.max(thumb.width!, thumb.height!)).toBeLessThanOrEqual(480);
    }
    const expected = photos.flatMap((p) => [p.fileId, thumbId(p.fileId)]).sort();
    expect((await storage.list()).sort()).toEqual(expected);
  });

  it('keeps the source images in content/ small', () => {
    const images = fs.readdirSync(path.join(contentDir, 'images')).filter((f) => f.endsWith('.png'));
    expect(images.length).toBeGreaterThanOrEqual(8);
    for (const f of images) expect(fs.statSync(path.join(contentDir, 'images', f)).size, f).toBeLessThan(60 * 1024);
  });

  it('when members already exist and no reset is asked, then nothing changes', async () => {
    const before = snapshot();
    const files = (await storage.list()).sort();
    const result = await seedDemo(db, { storage, clock }, {});
    expect(result.seeded).toBe(false);
    expect(result.counts).toEqual(firstCounts);
    expect(snapshot()).toEqual(before);
    expect((await storage.list()).sort()).toEqual(files);
  });

  it('when reset, then it empties every table and the stored photos and loads the same scenario again', async () => {
    const oldFiles = await storage.list();
    db.insert(t.mailOutbox).values({ to: 'x@example.com', subject: 's', text: 't', html: 'h', createdAt: new Date() }).run();
    db.update(t.swaps).set({ fittedCount: 99 }).run();

    const result = await seedDemo(db, { storage, clock }, { reset: true });
    expect(result.seeded).toBe(true);
    expect(result.counts).toEqual(firstCounts);
    // the stray message is gone; what is left is the demo's own: one per revision waiting on the desk or sent back
    const mails = db.select().from(t.mailOutbox).all();
    expect(mails.map((m) => m.to)).not.toContain('x@example.com');
    const waiting = db
      .select()
      .from(t.revisions)
      .all()
      .filter((r) => r.status === 'in_review' || r.status === 'sent_back');
    expect(mails).toHaveLength(waiting.length);
    expect(mails.filter((m) => m.subject.startsWith('Back for rework:'))).toHaveLength(
      waiting.filter((r) => r.status === 'sent_back').length,
    );
    expect(
      db
        .select()
        .from(t.swaps)
        .all()
        .some((s) => s.fittedCount === 99),
    ).toBe(false);
    expect(db.select({ id: t.users.id }).from(t.users).orderBy(t.users.id).get()!.id).toBe(1);

    const files = await storage.list();
    expect(files).toHaveLength(oldFiles.length);
    expect(files.some((f) => oldFiles.includes(f))).toBe(false);
    expect(db.$client.pragma('foreign_key_check')).toEqual([]);
  });

  it.each([
    [
      'a part line with quantity 0',
      (s: string) => s.replace("role: 'Front caliper, left', quantity: 1", "role: 'Front caliper, left', quantity: 0"),
      /quantity/,
    ],
    [
      'an unknown catalogue part',
      (s: string) => s.replace('part: orsino-vela-front-rotor-330,', 'part: no-such-rotor,'),
      /no-such-rotor/,
    ],
    ['a misspelt key', (s: string) => s.replace('installHours: 6', 'instalHours: 6'), /instalHours/],
  ])('when a swap file has %s, then it fails with the file name and changes nothing', async (_name, breakIt, reason) => {
    const broken = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-content-'));
    try {
      fs.cpSync(contentDir, broken, { recursive: true });
      const file = path.join(broken, 'swaps', 'h31-front-vela-four-piston-330.md');
      const original = fs.readFileSync(file, 'utf8');
      const changed = breakIt(original);
      expect(changed).not.toBe(original);
      fs.writeFileSync(file, changed);

      const before = snapshot();
      const files = (await storage.list()).sort();
      const attempt = seedDemo(db, { storage, clock }, { reset: true, contentDir: broken });
      await expect(attempt).rejects.toThrow('content/swaps/h31-front-vela-four-piston-330.md');
      await expect(attempt).rejects.toThrow(reason);
      expect(snapshot()).toEqual(before);
      expect((await storage.list()).sort()).toEqual(files);
    } finally {
      fs.rmSync(broken, { recursive: true, force: true });
    }
  });
});
