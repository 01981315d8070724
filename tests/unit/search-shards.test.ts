import { describe, expect, it } from 'vitest';
import { buildIndex } from '../../shared/search/search-engine';
import { planShards } from '../../shared/search/shard-plan';
import { ShardRouter } from '../../shared/search/shard-routing';
import { statsOf } from '../../shared/search/term-index';
import { decodeShards, encodeShards, indicesOf } from '../../shared/search/shard-bits';
import type { SearchRequest } from '../../shared/search/search-types';
import { ShardedIndex } from '../../src/features/search/worker/sharded-index';
import { makeDocuments, makeQueries, makeWorld } from '../bench/search-fixtures';
import { servePieces } from '../bench/support/index-pieces';
import { expectSameWhenSharded } from './support/sharded-search';

// A reader's browser loads the first index and only the shards a request needs; its answers must be
// the answers of the whole index.

const world = makeWorld(11, 60, 8);
const docs = makeDocuments(700, world);
const plan = planShards(docs, 40);
const served = servePieces(docs, world.chassis, 40);
const { head } = served.pieces;
const whole = buildIndex(docs);

/** the routing alone, with the code tables a query needs taken in as the worker does */
const router = new ShardRouter(head);
function route(request: SearchRequest) {
  for (const key of router.missingKeys(request.q))
    router.addTerms(served.pieces.terms.get(key) ?? { generation: head.generation, key, terms: {} });
  return router.route(request);
}
const shardOf = (slug: string) => head.chassis.find((x) => x.slug === slug)!.shard;

describe('the sharded index', () => {
  it('when a set of shards is written out, then it reads back the same, as a short list or a bitset', () => {
    for (const set of [[], [0], [3, 45], [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16]]) {
      const text = encodeShards(set, 170);
      expect(indicesOf(decodeShards(text, 170))).toEqual(set);
      // never longer than the bitset: 22 bytes over 170 shards, 32 characters of base64 and the mark
      expect(text.length).toBeLessThanOrEqual(33);
    }
    expect(encodeShards([45], 170)).toBe('19');
    expect(
      encodeShards(
        Array.from({ length: 40 }, (_, i) => i * 4),
        170,
      ),
    ).toMatch(/^\*/);
  });

  it('when the swaps are split, then the first index carries the whole collection’s figures', () => {
    expect(head.stats.documentCount).toBe(docs.length);
    const counted = statsOf(docs);
    head.stats.avgFieldLength.forEach((avg, f) => expect(avg).toBeCloseTo(counted.avgFieldLength[f], 9));
  }, 20_000);

  it('when the swaps are split, then every swap is in exactly one shard and a model is never split', () => {
    expect(plan.shards.length).toBeGreaterThan(8);
    expect(plan.shards.flatMap((s) => s.documents.map((d) => d.id)).sort((a, b) => a - b)).toEqual(docs.map((d) => d.id));
    const shardOfModel = new Map<string, string>();
    for (const s of plan.shards)
      for (const d of s.documents) {
        const key = `${d.chassis.make}/${d.chassis.model}`;
        expect(shardOfModel.get(key) ?? s.id).toBe(s.id);
        shardOfModel.set(key, s.id);
      }
  });

  it('when readers type 150 everyday queries, then the worker’s loaded shards answer each as the whole index', async () => {
    const index = new ShardedIndex(() => undefined, served.fetchPart);
    for (const q of makeQueries(150, docs, world)) await expectSameWhenSharded(whole, index, { q, limit: 20 });
  }, 120_000);

  it('when the queries need other names, typos, part-number pieces or filters, then the answers are the whole index’s', async () => {
    const index = new ShardedIndex(() => undefined, served.fetchPart);
    const c = docs[0].chassis;
    const requests: SearchRequest[] = [
      ...['disc', 'regnet', 'parking brake', 'front caliper', 'zzzqqq', 'ov-3', 'a1'].map((q) => ({ q, limit: 50 })),
      { filters: { chassis: c.slug }, limit: 20 },
      { q: 'caliper', filters: { chassis: c.slug, axle: 'front' }, limit: 20 },
      { q: 'caliper', filters: { make: c.make }, limit: 20 },
      { filters: { axle: 'rear', wheel: 16 }, sort: 'fitted', limit: 20 },
      { offset: 20, limit: 20 },
      { limit: 20 },
      { sort: 'fitted', limit: 20 },
    ];
    for (const r of requests) await expectSameWhenSharded(whole, index, r);
  }, 60_000);

  it('when a chassis is chosen, then only its shard is needed', () => {
    const c = docs[0].chassis;
    const r = route({ filters: { chassis: c.slug }, limit: 20 });
    expect(!r.browse && r.shards).toEqual([shardOf(c.slug)]);
  });

  it('when filters other than the chassis are set without words, then every shard is needed', () => {
    const r = route({ filters: { axle: 'rear', wheel: 16 }, sort: 'fitted', limit: 20 });
    expect(!r.browse && r.shards.length).toBe(plan.shards.length);
  });

  it('when nothing is typed or chosen, then page one comes from the first index alone', () => {
    expect(route({ limit: 20 }).browse).toBe(true);
    expect(route({ sort: 'fitted', limit: 20 }).browse).toBe(true);
    expect(route({ offset: 20, limit: 20 }).browse).toBe(false);
  });

  it('when a query names a chassis code, then that chassis’s shard is fetched first', () => {
    const c = docs[5].chassis;
    const r = route({ q: c.code });
    expect(!r.browse && r.shards[0]).toBe(shardOf(c.slug));
  });

  it('when a part number is typed, then the shards holding it and few others are needed', () => {
    const number = docs[3].partNumbers[0];
    const r = route({ q: number });
    if (r.browse) throw new Error('a query is never answered from the first index alone');
    const holding = plan.shards.flatMap((s, i) => (s.documents.some((d) => d.partNumbers.includes(number)) ? [i] : []));
    expect(r.shards).toEqual(expect.arrayContaining(holding));
    // the number's pieces may meet in a shard without meeting in one swap
    expect(r.shards.length).toBeLessThan(plan.shards.length / 3);
  });
});

describe('the worker loading shards', () => {
  it('when a word is in many shards, then the first answer comes after one shard and says how many are still coming', async () => {
    const { fetchPart, log } = servePieces(docs, world.chassis, 40);
    let arrivals = 0;
    const index = new ShardedIndex(() => arrivals++, fetchPart);
    const first = await index.answer({ q: 'caliper', limit: 20 });
    // answered from one shard; the next few are already on their way
    expect(arrivals).toBe(1);
    expect(log.filter((f) => f.arrived && f.path.includes('/shards/'))).toHaveLength(1);
    expect(first.pending).toBeGreaterThan(0);
    expect(first.total).toBeGreaterThan(0);
    const all = await index.answer({ q: 'caliper', limit: 20 }, { complete: true });
    expect(all.pending).toBe(0);
    expect(arrivals).toBeGreaterThan(1);
    // each piece is fetched once, however many answers needed it
    const paths = log.map((f) => f.path);
    expect(new Set(paths).size).toBe(paths.length);
  });

  it('when the first index moves on while a reader has the old one, then the worker reads it again and answers from the new one', async () => {
    const before = servePieces(docs.slice(0, 600), world.chassis, 40);
    const after = servePieces(docs, world.chassis, 40);
    let server = before;
    const index = new ShardedIndex(
      () => undefined,
      <T>(path: string, etag: string | null) => server.fetchPart<T>(path, etag),
    );
    await index.load();
    server = after;
    const answer = await index.answer({ q: docs[650].chassis.code, limit: 20 }, { complete: true });
    expect(answer.documentCount).toBe(700);
    expect(index.info().documentCount).toBe(700);
    await expectSameWhenSharded(whole, index, { q: docs[650].chassis.code, limit: 20 });
  }, 30_000);
});
