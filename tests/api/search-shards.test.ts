import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, type TestApp } from './support/test-app';
import { addUser, listen, signedInMember } from './support/auth-helpers';
import { addChassis } from './support/swap-fixtures';
import { addSwap, swapData } from './support/swap-rows';
import type { SearchHead, SearchShard, SearchTerms, ShardInfo } from '../../shared/search/shard-plan';
import { decodeShards, indicesOf } from '../../shared/search/shard-bits';
import { expectSharedAnswer } from './support/cache-headers';

// The search index in pieces: the first index every reader loads (revalidated on each visit), a shard
// per make and the tables that route part numbers and codes (at addresses that change with their
// content, so any cache may keep them for a year).

let t: TestApp;
let authorId: number;
let regent: number;

beforeAll(async () => {
  t = await makeTestApp();
  authorId = addUser(t.db, 'rivet_rosa').id;
  const h31 = addChassis(t.db).id;
  regent = addChassis(t.db, 'tamsin-regent', { make: 'Tamsin', model: 'Regent', code: 'TR2', yearFrom: 1995, yearTo: 2004 }).id;
  addChassis(t.db, 'orsino-vela', { make: 'Orsino', model: 'Vela', code: 'V3', yearFrom: 1994, yearTo: 2001 });
  addSwap(t.db, {
    slug: 'h31-vela-calipers',
    chassisId: h31,
    authorId,
    revisions: [{ status: 'approved', data: swapData('Vela calipers on the H31') }],
  });
  addSwap(t.db, {
    slug: 'regent-rear-rotors',
    chassisId: regent,
    authorId,
    revisions: [{ status: 'approved', data: swapData('Bigger rear rotors on the Regent') }],
  });
  addSwap(t.db, { slug: 'regent-draft', chassisId: regent, authorId, revisions: [{ status: 'draft' }] });
});
afterAll(() => t.close());

const get = (url: string, etag?: string) => {
  const r = request(t.app).get(url).set('accept-encoding', 'gzip');
  return etag ? r.set('if-none-match', etag) : r;
};
const shardNames = (head: SearchHead, bits: string) =>
  indicesOf(decodeShards(bits.split(':')[0], head.shards.length)).map((i) => head.shards[i].id);
const shardUrl = (s: ShardInfo) => `/api/search-index/shards/${s.id}/${s.hash}`;
const headOf = async () => (await get('/api/search-index/head')).body as SearchHead;
const immutable = 'public, max-age=31536000, immutable';

describe('GET /api/search-index/head', () => {
  it('when swaps are approved on two makes, then the first index lists a shard per make at the address of its content', async () => {
    const res = await get('/api/search-index/head');
    expect(res.status).toBe(200);
    expect(res.headers.etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    // the same for every reader, and checked again by the browser on every visit so an approval shows at once
    expectSharedAnswer(res);
    const head = res.body as SearchHead;
    expect(head.documentCount).toBe(2);
    expect(head.shards.map((s) => [s.id, s.count])).toEqual([
      ['halden', 1],
      ['tamsin', 1],
    ]);
    for (const s of head.shards) {
      expect(s.hash).toMatch(/^[A-Za-z0-9_-]{16}$/);
      expect((await get(shardUrl(s))).status).toBe(200);
    }
    expect((await get('/api/search-index/head', res.headers.etag)).status).toBe(304);
  });

  it('when a catalogue chassis has no swap yet, then the first index still lists it for the chassis picker', async () => {
    const head = await headOf();
    expect(head.chassis.map((c) => [c.slug, c.count, c.shard === null ? null : head.shards[c.shard].id])).toEqual([
      ['halden-h31', 1, 'halden'],
      ['orsino-vela', 0, null],
      ['tamsin-regent', 1, 'tamsin'],
    ]);
  });

  it('when a word is in one make’s swaps, then the first index routes it to that shard only', async () => {
    const head = await headOf();
    expect(shardNames(head, head.words['bigger'])).toEqual(['tamsin']);
    expect(shardNames(head, head.words['caliper']).sort()).toEqual(['halden', 'tamsin']);
    // page one of the newest swaps is ready without any shard
    expect(head.browse.newest.hits.map((h) => h.doc.slug).sort()).toEqual(['h31-vela-calipers', 'regent-rear-rotors']);
    expect(head.browse.newest.total).toBe(2);
  });
});

describe('GET /api/search-index/shards/:shard/:hash', () => {
  it('when a shard is fetched, then it holds that make’s approved swaps and any cache may keep it for a year', async () => {
    const tamsin = (await headOf()).shards.find((s) => s.id === 'tamsin')!;
    const res = await get(shardUrl(tamsin));
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers['cache-control']).toBe(immutable);
    expect((res.body as SearchShard).documents.map((d) => d.slug)).toEqual(['regent-rear-rotors']);
    expect((await get(shardUrl(tamsin), res.headers.etag)).status).toBe(304);
  });

  it('when a signed-in member fetches a shard, then the answer carries no cookie', async () => {
    const { agent } = listen(t.app);
    const member = await signedInMember(t.db, agent, 'camber_kai');
    const halden = (await headOf()).shards.find((s) => s.id === 'halden')!;
    const res = await member.agent.get(shardUrl(halden));
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe(immutable);
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  it('when the hash is not the shard’s current one, then the answer is 404 and is not kept', async () => {
    const res = await get('/api/search-index/shards/tamsin/AAAAAAAAAAAAAAAA');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect(res.headers['cache-control']).not.toMatch(/max-age=31536000/);
  });

  it('when the shard does not exist, then the answer is 404 in the error shape', async () => {
    const res = await get('/api/search-index/shards/nobody/AAAAAAAAAAAAAAAA');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('when the shard name is not a slug or the hash is malformed, then the answer is 400 naming the field', async () => {
    const res = await get('/api/search-index/shards/Not%20A%20Slug/AAAAAAAAAAAAAAAA');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields ?? {})).toContain('shard');
    const short = await get('/api/search-index/shards/tamsin/abc');
    expect(short.status).toBe(400);
    expect(Object.keys(short.body.error.fields ?? {})).toContain('hash');
  });
});

describe('GET /api/search-index/terms/:generation/:key', () => {
  it('when part numbers start with the key, then the table routes each to its shards and may be kept for a year', async () => {
    const head = await headOf();
    const res = await get(`/api/search-index/terms/${head.generation}/ov`);
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe(immutable);
    const table = res.body as SearchTerms;
    expect(table.generation).toBe(head.generation);
    expect(shardNames(head, table.terms['ov355104l']).sort()).toEqual(['halden', 'tamsin']);
    // the count after the colon is how many swaps hold the term
    expect(table.terms['ov355104l'].split(':')[1]).toBe('2');
  });

  it('when no term starts with the key, then the table is empty', async () => {
    const head = await headOf();
    const res = await get(`/api/search-index/terms/${head.generation}/zz`);
    expect(res.status).toBe(200);
    expect((res.body as SearchTerms).terms).toEqual({});
  });

  it('when the generation is not the current one, then the answer is 404', async () => {
    const res = await get('/api/search-index/terms/AAAAAAAAAAAAAAAA/ov');
    expect(res.status).toBe(404);
  });

  it('when the key is longer than two characters, then the answer is 400 naming the field', async () => {
    const head = await headOf();
    const res = await get(`/api/search-index/terms/${head.generation}/ov3`);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields ?? {})).toContain('key');
  });
});

describe('a new approval', () => {
  it('when a swap is approved on one make, then that shard moves to a new address and the other shard keeps its own', async () => {
    const before = await headOf();
    addSwap(t.db, {
      slug: 'regent-front-rotors',
      chassisId: regent,
      authorId,
      revisions: [{ status: 'approved', data: swapData('Front rotors on the Regent') }],
    });
    const after = await headOf();
    expect(after.generation).not.toBe(before.generation);
    const shard = (h: SearchHead, id: string) => h.shards.find((s) => s.id === id)!;
    expect(shard(after, 'tamsin').hash).not.toBe(shard(before, 'tamsin').hash);
    expect(shard(after, 'halden').hash).toBe(shard(before, 'halden').hash);
    // the old address is gone: a reader holding the old first index reads it again
    expect((await get(shardUrl(shard(before, 'tamsin')))).status).toBe(404);
    expect((await get(shardUrl(shard(after, 'tamsin')))).body.documents).toHaveLength(2);
  });
});
