import fs from 'node:fs';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { makeTestApp } from './support/test-app';
import { listen, signedInMember, type Member } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap } from './support/swap-rows';
import { createApp } from '../../server/app';
import { createDiskStorage, type Storage } from '../../server/storage/disk-storage';
import { sweepOrphanFiles } from '../../server/features/photos/orphan-files';
import { fittedReports } from '../../server/db/schema/index';

// Photo files that no row points at: none left behind by a failed or racing write, and a sweep
// for whatever a crash leaves.

const cleanup: (() => unknown)[] = [];
afterEach(async () => {
  for (const fn of cleanup.splice(0).reverse()) await fn();
});

const png = (r: number) =>
  sharp({ create: { width: 64, height: 48, channels: 3, background: { r, g: 77, b: 58 } } })
    .png()
    .toBuffer();

const filesIn = (dir: string) => (fs.existsSync(dir) ? fs.readdirSync(dir).sort() : []);

/** An app whose storage is wrapped (to fail or slow down writes), with an approved swap to report on. */
async function world(wrap: (storage: Storage) => Storage = (s) => s) {
  const t = await makeTestApp();
  cleanup.push(() => t.close());
  const storage = wrap(t.storage);
  const app = createApp({
    db: t.db,
    mailer: t.mailer,
    storage,
    clock: { now: () => new Date() },
    config: t.config,
    logger: t.logger,
  });
  const { server, agent } = listen(app);
  cleanup.push(() => server.close());
  const author = await signedInMember(t.db, agent, 'rivet_rosa');
  const kai = await signedInMember(t.db, agent, 'camber_kai');
  addSwap(t.db, {
    slug: 'h31-vela-front',
    chassisId: addChassis(t.db).id,
    authorId: author.id,
    revisions: [{ status: 'approved' }],
  });
  return { t, kai };
}

const report = async (m: Member, method: 'post' | 'patch', photo: Buffer) =>
  m.agent[method](`/api/swaps/h31-vela-front/fitted-reports${method === 'patch' ? '/mine' : ''}`)
    .set('x-csrf-token', m.token)
    .field('diameterIn', '16')
    .field('widthIn', '7')
    .field('offsetMm', '38')
    .attach('photo', photo, { filename: 'wheel.png', contentType: 'image/png' });

describe('files no row points at', () => {
  it('when a write fails before its rename, then no half-written .tmp file is left', async () => {
    const t = await makeTestApp();
    cleanup.push(() => t.close());
    const storage = createDiskStorage(t.config.uploadDir);
    fs.mkdirSync(path.join(t.config.uploadDir, 'abcdefghijklmnop'), { recursive: true }); // the rename target is in the way
    await expect(storage.put('abcdefghijklmnop', Buffer.from('photo bytes'))).rejects.toThrow();
    expect(filesIn(t.config.uploadDir)).toEqual(['abcdefghijklmnop']);
  });

  it('when a fitted report’s thumbnail cannot be written, then its full-size file does not stay either', async () => {
    const { t, kai } = await world((s) => ({
      ...s,
      put: (id, data) => (id.endsWith('_t') ? Promise.reject(new Error('no space left on device')) : s.put(id, data)),
    }));
    const res = await report(kai, 'post', await png(10));
    expect(res.status).toBe(500);
    expect(t.db.select().from(fittedReports).all()).toEqual([]);
    expect(filesIn(t.config.uploadDir)).toEqual([]);
  });

  it('when two edits replace a report’s photo at once, then only the photo the report keeps is on disk', async () => {
    const { t, kai } = await world((s) => ({
      ...s,
      // slow writes, so both edits have read the report before either saves it
      put: async (id, data) => {
        await new Promise((r) => setTimeout(r, 150));
        return s.put(id, data);
      },
    }));
    expect((await report(kai, 'post', await png(10))).status).toBe(201);
    const [a, b] = await Promise.all([report(kai, 'patch', await png(100)), report(kai, 'patch', await png(200))]);
    expect([a.status, b.status]).toEqual([200, 200]);
    const kept = t.db.select().from(fittedReports).get()!.photoFileId!;
    expect(filesIn(t.config.uploadDir)).toEqual([kept, `${kept}_t`]);
  });

  it('when the sweep runs, then files older than an hour that no row points at and stale .tmp files go; the rest stay', async () => {
    const { t, kai } = await world();
    expect((await report(kai, 'post', await png(10))).status).toBe(201);
    const kept = t.db.select().from(fittedReports).get()!.photoFileId!;
    const dir = t.config.uploadDir;
    const write = (name: string, ageMs: number) => {
      fs.writeFileSync(path.join(dir, name), 'x');
      const at = new Date(Date.now() - ageMs);
      fs.utimesSync(path.join(dir, name), at, at);
    };
    const hours = (h: number) => h * 60 * 60 * 1000;
    write('oldorphan000001', hours(3));
    write('oldorphan000001_t', hours(3));
    write('.tmp-0123456789ab', hours(2));
    write('neworphan000001', hours(0.5)); // may still be waiting for its row
    write('.tmp-ba9876543210', 60_000);
    for (const f of [kept, `${kept}_t`]) {
      const at = new Date(Date.now() - hours(5));
      fs.utimesSync(path.join(dir, f), at, at);
    }

    const removed = await sweepOrphanFiles({ db: t.db, storage: t.storage, clock: { now: () => new Date() } });
    expect(removed.sort()).toEqual(['.tmp-0123456789ab', 'oldorphan000001', 'oldorphan000001_t']);
    expect(filesIn(dir)).toEqual(['.tmp-ba9876543210', kept, `${kept}_t`, 'neworphan000001'].sort());
  });
});
