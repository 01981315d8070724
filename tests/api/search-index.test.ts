import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { makeTestApp, type TestApp } from './support/test-app';
import { revisions, swaps } from '../../server/db/schema/index';
import type { RevisionStatus } from '../../shared/schemas/enums';
import { addUser } from './support/auth-helpers';
import { addChassis, addPart } from './support/swap-fixtures';
import { addSwap as addSwapRows, swapData } from './support/swap-rows';
import type { SearchIndexResponse } from '../../shared/search/search-document';
import { expectSharedAnswer } from './support/cache-headers';

let t: TestApp;
let authorId: number;
let chassisId: number;

/** what the index needs to show: machining (minor), two cost routes, no parking brake on the front axle */
const indexed = {
  machining: [{ component: 'dust_shield' as const, operation: 'trim' as const, where: 'Dust shield edge', required: true }],
  costs: [
    { route: 'as_built' as const, item: 'Used calipers', amountMinor: 32000 },
    { route: 'as_built' as const, item: 'Brackets', amountMinor: 14000 },
    { route: 'new_kit' as const, item: 'Complete kit', amountMinor: 98000 },
  ],
};

/** A swap with one revision per given status; the swap's current revision is the approved one, if any. */
function addSwap(
  slug: string,
  statuses: RevisionStatus[],
  titles: string[] = statuses.map((s, i) => `${slug} ${s} revision ${i + 1}`),
) {
  return addSwapRows(t.db, {
    slug,
    chassisId,
    authorId,
    revisions: statuses.map((status, i) => ({ status, data: swapData(titles[i], indexed) })),
  });
}

beforeAll(async () => {
  t = await makeTestApp();
  authorId = addUser(t.db, 'rivet_rosa').id;
  chassisId = addChassis(t.db).id;
});
afterAll(() => t.close());

const getIndex = (etag?: string) => {
  const r = request(t.app).get('/api/search-index').set('accept-encoding', 'gzip');
  return etag ? r.set('if-none-match', etag) : r;
};

describe('GET /api/search-index', () => {
  it('when swaps sit in every status, then only approved current revisions are in the index', async () => {
    addSwap('approved-one', ['approved']);
    addSwap('only-draft', ['draft']);
    addSwap('only-in-review', ['in_review']);
    addSwap('only-sent-back', ['sent_back']);
    addSwap('only-declined', ['declined']);
    addSwap('approved-with-pending-edit', ['approved', 'in_review'], ['Approved text of the sheet', 'Pending edit of the sheet']);
    addSwap('superseded-then-approved', ['superseded', 'approved'], ['Old approved text', 'New approved text']);

    const res = await getIndex();
    expect(res.status).toBe(200);
    const body = res.body as SearchIndexResponse;
    expect(body.documents.map((d) => d.slug).sort()).toEqual([
      'approved-one',
      'approved-with-pending-edit',
      'superseded-then-approved',
    ]);
    const titles = Object.fromEntries(body.documents.map((d) => [d.slug, d.title]));
    expect(titles['approved-with-pending-edit']).toBe('Approved text of the sheet');
    expect(titles['superseded-then-approved']).toBe('New approved text');

    const doc = body.documents.find((d) => d.slug === 'approved-one')!;
    expect(doc.chassis).toEqual({ slug: 'halden-h31', make: 'Halden', model: 'H31', code: 'H31', yearFrom: 1991, yearTo: 1999 });
    expect(doc.partNumbers).toEqual(['OV-355-104-L', 'OV-355-104-R']);
    expect(doc.cameOn).toEqual(['Orsino Vela 2.0 (1996–2001)']);
    expect(doc.adapter).toEqual({ name: 'H31 caliper bracket', maker: 'Northgate Fabrication', partNumber: 'NF-H31-VB' });
    expect(doc.machining).toBe('minor');
    expect(doc.minWheelIn).toBe(16);
    // as built 320 + 140 = 460, new kit 980
    expect(doc.cost).toEqual({ min: 46000, max: 98000, currency: 'EUR' });
  });

  it('when the client sends back the ETag it holds, then the answer is 304 with no body', async () => {
    const first = await getIndex();
    expect(first.headers.etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expectSharedAnswer(first);
    const again = await getIndex(first.headers.etag);
    expect(again.status).toBe(304);
    expect(again.text).toBe('');
    const stale = await getIndex('"something-else"');
    expect(stale.status).toBe(200);
  });

  it('when the index is large enough, then it travels compressed', async () => {
    for (let i = 0; i < 6; i++) addSwap(`bulk-${i}`, ['approved']);
    const res = await getIndex();
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect((res.body as SearchIndexResponse).documents.length).toBe(9);
  });

  it('when a swap gets a newly approved revision, then the index and its ETag change', async () => {
    const { swapId, revisionIds } = addSwap(
      'about-to-change',
      ['approved', 'in_review'],
      ['Before the correction', 'After the correction'],
    );
    const before = await getIndex();
    expect((before.body as SearchIndexResponse).documents.find((d) => d.slug === 'about-to-change')?.title).toBe(
      'Before the correction',
    );

    const later = new Date(Date.now() + 60_000);
    t.db.update(revisions).set({ status: 'superseded', updatedAt: later }).where(eq(revisions.id, revisionIds[0])).run();
    t.db
      .update(revisions)
      .set({ status: 'approved', reviewedAt: later, updatedAt: later })
      .where(eq(revisions.id, revisionIds[1]))
      .run();
    t.db.update(swaps).set({ currentRevisionId: revisionIds[1], updatedAt: later }).where(eq(swaps.id, swapId)).run();

    const after = await getIndex(before.headers.etag);
    expect(after.status).toBe(200);
    expect(after.headers.etag).not.toBe(before.headers.etag);
    const doc = (after.body as SearchIndexResponse).documents.find((d) => d.slug === 'about-to-change')!;
    expect(doc.title).toBe('After the correction');
    expect(doc.updatedAt).toBe(later.toISOString());
  });

  it('when only a fitted-report count changes, then the index changes too', async () => {
    const before = await getIndex();
    const target = (before.body as SearchIndexResponse).documents.find((d) => d.slug === 'approved-one')!;
    t.db
      .update(swaps)
      .set({ fittedCount: target.fittedCount + 1 })
      .where(eq(swaps.id, target.id))
      .run();
    const after = await getIndex(before.headers.etag);
    expect(after.status).toBe(200);
    expect((after.body as SearchIndexResponse).documents.find((d) => d.id === target.id)!.fittedCount).toBe(
      target.fittedCount + 1,
    );
  });

  it('when an approved swap is taken back to no current revision, then it leaves the index', async () => {
    const before = await getIndex();
    const target = (before.body as SearchIndexResponse).documents.find((d) => d.slug === 'bulk-0')!;
    t.db.update(swaps).set({ currentRevisionId: null }).where(eq(swaps.id, target.id)).run();
    const after = await getIndex(before.headers.etag);
    expect(after.status).toBe(200);
    expect((after.body as SearchIndexResponse).documents.some((d) => d.slug === 'bulk-0')).toBe(false);
  });

  it('when a catalogue part’s notes name an older number, then the swaps that use the part are indexed under it', async () => {
    const part = addPart(t.db, 'vela-caliper-right', {
      partNumbers: ['OV-355-104-R'],
      notes: 'Early calipers carry the stamp OV-355-101-R and are the same casting.',
    });
    const line = swapData('Any title will do').parts[0];
    addSwapRows(t.db, {
      slug: 'uses-catalogue-part',
      chassisId,
      authorId,
      revisions: [
        {
          status: 'approved',
          data: swapData('Vela calipers from the catalogue', {
            parts: [{ ...line, partId: part.id, partNumbers: ['OV-355-104-R'], notes: 'Bought as OV.355.102.R from a breaker.' }],
          }),
        },
      ],
    });
    const res = await getIndex();
    const doc = (res.body as SearchIndexResponse).documents.find((d) => d.slug === 'uses-catalogue-part')!;
    expect(doc.partNumbers).toEqual(['OV-355-104-R']);
    expect(doc.otherNumbers).toEqual(['OV.355.102.R', 'OV-355-101-R']);
  });
});
