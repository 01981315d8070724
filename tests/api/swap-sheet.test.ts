import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, approveNewRevision, swapData } from './support/swap-rows';
import { swaps, users } from '../../server/db/schema/index';
import { closeDb, openDb } from '../../server/db/client';

let t: TestApp;
let authorId: number;
let swapId: number;
beforeAll(async () => {
  t = await makeTestApp();
  authorId = addUser(t.db, 'rivet_rosa').id;
  const c = addChassis(t.db);
  swapId = addSwap(t.db, {
    slug: 'h31-vela-front',
    chassisId: c.id,
    authorId,
    revisions: [{ status: 'approved', data: swapData('Vela calipers on the H31, first write-up') }],
  }).swapId;
  addSwap(t.db, { slug: 'h31-only-draft', chassisId: c.id, authorId, revisions: [{ status: 'draft' }] });
});
afterAll(() => t.close());

describe('GET /api/swaps/:slug', () => {
  it('when a swap has an approved revision, then the sheet carries it with chassis, history and author', async () => {
    const res = await request(t.app).get('/api/swaps/h31-vela-front');
    expect(res.status).toBe(200);
    expect(res.body.revision.data.title).toBe('Vela calipers on the H31, first write-up');
    expect(res.body.revision.number).toBe(1);
    expect(res.body.chassis.slug).toBe('halden-h31');
    expect(res.body.currentNumber).toBe(1);
    expect(res.body.history.map((h: { number: number }) => h.number)).toEqual([1]);
    expect(res.body.swap.author.login).toBe('rivet_rosa');
    // an anonymous reader is not handed a session
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  it('when the swap is unknown or has only a draft, then the answer is a 404 in the error shape', async () => {
    for (const slug of ['no-such-swap', 'h31-only-draft']) {
      const res = await request(t.app).get(`/api/swaps/${slug}`);
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
    const bad = await request(t.app).get('/api/swaps/Not_A_Slug!');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('slug');
  });

  it('when the reader already has the current sheet, then a 304 answers without a body; gzip is sent when asked for', async () => {
    const first = await request(t.app).get('/api/swaps/h31-vela-front').set('accept-encoding', 'gzip');
    expect(first.headers['content-encoding']).toBe('gzip');
    const etag = first.headers.etag;
    expect(etag).toMatch(/^"/);
    const again = await request(t.app).get('/api/swaps/h31-vela-front').set('if-none-match', etag);
    expect(again.status).toBe(304);
    expect(again.text ?? '').toBe('');
  });

  it('when a new revision is approved or the author renames themselves, then the sheet and its ETag change', async () => {
    const before = await request(t.app).get('/api/swaps/h31-vela-front');
    approveNewRevision(t.db, swapId, swapData('Vela calipers on the H31, corrected torque'), authorId);
    const after = await request(t.app).get('/api/swaps/h31-vela-front');
    expect(after.body.revision.data.title).toBe('Vela calipers on the H31, corrected torque');
    expect(after.body.revision.number).toBe(2);
    expect(after.headers.etag).not.toBe(before.headers.etag);
    const old = await request(t.app).get('/api/swaps/h31-vela-front/revisions/1');
    expect(old.status).toBe(200);
    expect(old.body.revision.status).toBe('superseded');
    expect(old.body.currentNumber).toBe(2);

    t.db
      .update(users)
      .set({ name: 'Rosa R.', updatedAt: new Date(Date.now() + 1000) })
      .where(eq(users.id, authorId))
      .run();
    const renamed = await request(t.app).get('/api/swaps/h31-vela-front');
    expect(renamed.body.swap.author.name).toBe('Rosa R.');

    t.db.update(swaps).set({ fittedCount: 4 }).where(eq(swaps.id, swapId)).run();
    const counted = await request(t.app).get('/api/swaps/h31-vela-front');
    expect(counted.body.swap.fittedCount).toBe(4);
  });

  it('when another process writes to the database, then the next read of the sheet shows it', async () => {
    // a second connection stands for another process (a maintenance script, a second server)
    const other = openDb(t.config.databaseUrl);
    try {
      const before = await request(t.app).get('/api/swaps/h31-vela-front');
      other.update(swaps).set({ fittedCount: 9 }).where(eq(swaps.id, swapId)).run();
      const after = await request(t.app).get('/api/swaps/h31-vela-front');
      expect(after.body.swap.fittedCount).toBe(9);
      expect(after.headers.etag).not.toBe(before.headers.etag);
    } finally {
      closeDb(other);
    }
  });

  it('when a sheet is asked for with HEAD, then the headers come without the body', async () => {
    const get = await request(t.app).get('/api/swaps/h31-vela-front').set('accept-encoding', 'gzip');
    const head = await request(t.app).head('/api/swaps/h31-vela-front').set('accept-encoding', 'gzip');
    expect(head.status).toBe(200);
    expect(head.headers.etag).toBe(get.headers.etag);
    expect(head.headers['content-length']).toBe(get.headers['content-length']);
    expect(head.text ?? '').toBe('');
  });
});
