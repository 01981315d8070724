import type { Server } from 'node:http';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { and, eq, inArray } from 'drizzle-orm';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { makeTestApp, type TestApp } from './support/test-app';
import { listen, signedInMember, type Agent, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, swapData } from './support/swap-rows';
import { revisionPhotos, revisions } from '../../server/db/schema/index';
import { closeDb, openDb } from '../../server/db/client';
import { processPhoto } from '../../server/features/photos/photo-processing';

// Corrections of an approved swap: one open correction per member per swap, held by the database.

let t: TestApp;
let server: Server;
let agent: () => Agent;
let chassisId: number;
let rosa: Member;
let kai: Member;

beforeAll(async () => {
  t = await makeTestApp({ SUBMISSION_RATE_LIMIT: '1000' });
  ({ server, agent } = listen(t.app));
  chassisId = addChassis(t.db).id;
  rosa = await signedInMember(t.db, agent, 'rivet_rosa');
  kai = await signedInMember(t.db, agent, 'camber_kai');
});
afterAll(() => {
  server.close();
  t.close();
});

/** An approved swap whose current revision has photos, so a correction has files to copy before it is stored. */
async function approvedSwapWithPhotos(slug: string, photos = 3) {
  const swap = addSwap(t.db, { slug, chassisId, authorId: rosa.id, revisions: [{ status: 'approved' }] });
  for (let i = 0; i < photos; i++) {
    const source = await sharp({ create: { width: 800, height: 600, channels: 3, background: { r: 40 * i, g: 77, b: 58 } } })
      .jpeg()
      .toBuffer();
    const p = await processPhoto(source);
    const fileId = `${slug.replace(/[^a-z0-9]/g, '')}photo${i}xxxxxx`.slice(0, 30);
    await t.storage.put(fileId, p.full);
    await t.storage.put(`${fileId}_t`, p.thumb);
    t.db
      .insert(revisionPhotos)
      .values({
        revisionId: swap.revisionIds[0]!,
        fileId,
        position: i,
        width: p.width,
        height: p.height,
        bytes: p.full.length,
        sha256: p.sha256,
        createdAt: new Date(),
      })
      .run();
  }
  return swap;
}

const openCorrections = (swapId: number, authorId: number) =>
  t.db
    .select()
    .from(revisions)
    .where(
      and(
        eq(revisions.swapId, swapId),
        eq(revisions.authorId, authorId),
        inArray(revisions.status, ['draft', 'sent_back', 'in_review']),
      ),
    )
    .all();

describe('one open correction per swap per member', () => {
  it('when a member sends the same correction three times at once, then one draft is made and the others are 409', async () => {
    const swap = await approvedSwapWithPhotos('h31-parallel');
    const post = () =>
      kai.agent
        .post('/api/submissions')
        .set('x-csrf-token', kai.token)
        .send({ swapSlug: swap.slug, changeNote: 'Re-measured on the car; the figures now match the parts.', data: swapData('A correction sent three times at once') });
    const answers = await Promise.all([post(), post(), post()]);
    expect(answers.map((a) => a.status).sort()).toEqual([201, 409, 409]);
    for (const refused of answers.filter((a) => a.status === 409)) expect(refused.body.error.code).toBe('open_revision');
    expect(openCorrections(swap.swapId, kai.id)).toHaveLength(1);
    // the refused requests' photo copies were not left behind
    const referenced = new Set(
      t.db
        .select({ fileId: revisionPhotos.fileId })
        .from(revisionPhotos)
        .all()
        .map((r) => r.fileId),
    );
    const onDisk = (await t.storage.list()).filter((f) => !f.endsWith('_t'));
    expect(onDisk.filter((f) => !referenced.has(f))).toEqual([]);
  });

  it('when the database is written to directly, then it refuses a second open revision by the same member', () => {
    const swap = addSwap(t.db, { slug: 'h31-direct', chassisId, authorId: rosa.id, revisions: [{ status: 'approved' }] });
    const row = (number: number, status: 'draft' | 'in_review' | 'sent_back' | 'declined') => ({
      swapId: swap.swapId,
      number,
      authorId: kai.id,
      status,
      data: swapData('Direct insert'),
      createdAt: new Date(),
      updatedAt: new Date(),
    });
    t.db.insert(revisions).values(row(2, 'in_review')).run();
    expect(() => t.db.insert(revisions).values(row(3, 'draft')).run()).toThrow(/UNIQUE constraint failed/);
    // a closed one (declined) does not count
    t.db.insert(revisions).values(row(3, 'declined')).run();
  });

  it('when the member’s earlier correction was declined, then they may start a new one', async () => {
    const swap = addSwap(t.db, {
      slug: 'h31-after-decline',
      chassisId,
      authorId: rosa.id,
      revisions: [{ status: 'approved' }],
    });
    const first = await kai.agent
      .post('/api/submissions')
      .set('x-csrf-token', kai.token)
      .send({ swapSlug: swap.slug, changeNote: 'Re-measured on the car; the figures now match the parts.', data: swapData('First try at a correction') });
    expect(first.status).toBe(201);
    t.db.update(revisions).set({ status: 'declined' }).where(eq(revisions.id, first.body.id)).run();
    const second = await kai.agent
      .post('/api/submissions')
      .set('x-csrf-token', kai.token)
      .send({ swapSlug: swap.slug, changeNote: 'Re-measured on the car; the figures now match the parts.', data: swapData('Second try at a correction') });
    expect(second.status).toBe(201);
  });
});

describe('the migration that adds the rule', () => {
  it('when an older database holds several open revisions by one member on a swap, then the newest stays open and the others are closed with a note', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'swapyard-migration-'));
    try {
      // the migrations folder as it was before this rule: the first migration only
      const before = path.join(dir, 'drizzle');
      fs.cpSync(path.resolve(import.meta.dirname, '../../drizzle'), before, { recursive: true });
      const journalFile = path.join(before, 'meta', '_journal.json');
      const journal = JSON.parse(fs.readFileSync(journalFile, 'utf8'));
      const ruleAt = journal.entries.findIndex((e: { tag: string }) => e.tag.endsWith('_one_open_revision'));
      fs.writeFileSync(journalFile, JSON.stringify({ ...journal, entries: journal.entries.slice(0, ruleAt) }));
      const db = openDb(path.join(dir, 'old.db'));
      migrate(db, { migrationsFolder: before });
      // rows written with the columns the tables had then: later migrations add more
      const now = Date.now();
      const sqlite = db.$client;
      const userId = sqlite
        .prepare(
          "insert into users (provider, provider_id, login, created_at, updated_at) values ('github', 'demo-x', 'camber_kai', ?, ?)",
        )
        .run(now, now).lastInsertRowid;
      const chassisId = sqlite
        .prepare(
          `insert into chassis (slug, make, model, code, year_from, lug_count, pcd_mm, centre_bore_mm, wheel_bolt_thread,
             stock_wheel, stock_brakes, created_at, updated_at)
           values ('halden-h31', 'Halden', 'H31', 'H31', 1991, 5, 112, 66.6, 'M12x1.5', '{}', '{}', ?, ?)`,
        )
        .run(now, now).lastInsertRowid;
      const swapId = sqlite
        .prepare(
          "insert into swaps (slug, chassis_id, axle, category, author_id, created_at, updated_at) values ('s', ?, 'front', 'brakes', ?, ?, ?)",
        )
        .run(chassisId, userId, now, now).lastInsertRowid;
      const insertOld = sqlite.prepare(
        'insert into revisions (swap_id, number, author_id, status, data, created_at, updated_at) values (?, ?, ?, ?, ?, ?, ?)',
      );
      for (const [number, status] of [
        [1, 'approved'],
        [2, 'draft'],
        [3, 'in_review'],
        [4, 'draft'],
      ] as const)
        insertOld.run(swapId, number, userId, status, JSON.stringify(swapData(`Revision ${number}`)), now, now);
      migrate(db, { migrationsFolder: path.resolve(import.meta.dirname, '../../drizzle') });
      const rows = db.select().from(revisions).orderBy(revisions.number).all();
      expect(rows.map((r) => r.status)).toEqual(['approved', 'declined', 'declined', 'draft']);
      expect(rows[1]!.reviewNote).toMatch(/newer open revision/);
      closeDb(db);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
