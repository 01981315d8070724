import { describe, expect, it } from 'vitest';
import { addDocuments, buildIndex, createIndex, search } from '../../shared/search/search-engine';
import { assembleHead, browseAnswers, planShards, type SearchHead } from '../../shared/search/shard-plan';
import { ShardRouter } from '../../shared/search/shard-routing';
import { statsOf } from '../../shared/search/term-index';
import type { SearchRequest, SearchResponse } from '../../shared/search/search-types';
import { makeDocuments, makeQueries, makeWorld } from '../bench/search-fixtures';

// A reader's browser loads the first index and only the shards a request needs; its answers must be
// the answers of the whole index.

const world = makeWorld(11, 60, 8);
const docs = makeDocuments(700, world);
const plan = planShards(docs, 40);
const head: SearchHead = assembleHead({
  plan,
  etags: plan.shards.map((s) => `"${s.id}"`),
  generation: 'g1',
  stats: statsOf(docs),
  catalogue: world.chassis,
  browse: browseAnswers(docs),
});
const whole = buildIndex(docs);

/** What the worker does: load the code tables and shards the route names, then search what is loaded. */
function sharded(request: SearchRequest) {
  const router = new ShardRouter(head);
  for (const key of router.missingKeys(request.q))
    router.addTerms({ generation: head.generation, key, terms: plan.chunks.get(key) ?? {} });
  const route = router.route(request);
  if (route.browse) return { route, answer: request.sort === 'fitted' ? head.browse.fitted : head.browse.newest };
  const index = createIndex(head.stats);
  index.text.useWholeDocFreq((t) => router.docFreq(t));
  for (const s of route.shards) addDocuments(index, plan.shards[s].documents);
  return { route, answer: search(index, request) };
}

const ids = (r: SearchResponse) => r.hits.map((h) => h.doc.id);
const nonNested = ({ make: _m, model: _o, chassis: _c, ...rest }: SearchResponse['facets']) => rest;

function expectSame(request: SearchRequest) {
  const expected = search(whole, request);
  const { route, answer } = sharded(request);
  expect(ids(answer), JSON.stringify(request)).toEqual(ids(expected));
  expect(answer.total).toBe(expected.total);
  expect(answer.matchedAll).toBe(expected.matchedAll);
  expect(answer.hits.map((h) => h.score)).toEqual(expected.hits.map((h) => h.score));
  if (!route.browse && route.restricted) expect(nonNested(answer.facets)).toEqual(nonNested(expected.facets));
  else expect(answer.facets).toEqual(expected.facets);
  return route;
}

describe('the sharded index', () => {
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

  it.each(makeQueries(150, docs, world).map((q) => [q]))(
    'when the reader types "%s", then the loaded shards answer as the whole index',
    (q) => {
      expectSame({ q, limit: 20 });
    },
  );

  it.each(['disc', 'regnet', 'parking brake', 'front caliper', 'zzzqqq', 'ov-3', 'a1'])(
    'when the query is "%s", then the loaded shards answer as the whole index',
    (q) => {
      expectSame({ q, limit: 50 });
    },
  );

  it('when a chassis is chosen, then only its shard is loaded and the results are the same', () => {
    const c = docs[0].chassis;
    const route = expectSame({ filters: { chassis: c.slug }, limit: 20 });
    expect(route.browse).toBe(false);
    if (!route.browse) expect(route.shards).toEqual([head.chassis.find((x) => x.slug === c.slug)!.shard]);
    expectSame({ q: 'caliper', filters: { chassis: c.slug, axle: 'front' }, limit: 20 });
  });

  it('when filters other than the chassis are set without words, then every shard is needed', () => {
    const route = expectSame({ filters: { axle: 'rear', wheel: 16 }, sort: 'fitted', limit: 20 });
    expect(!route.browse && route.shards.length).toBe(plan.shards.length);
  });

  it('when nothing is typed or chosen, then page one comes from the first index alone', () => {
    expect(expectSame({ limit: 20 }).browse).toBe(true);
    expect(expectSame({ sort: 'fitted', limit: 20 }).browse).toBe(true);
    expect(expectSame({ offset: 20, limit: 20 }).browse).toBe(false);
  });

  it('when a query names a chassis code, then that chassis’s shard is fetched first', () => {
    const c = docs[5].chassis;
    const { route } = sharded({ q: c.code });
    expect(!route.browse && route.shards[0]).toBe(head.chassis.find((x) => x.slug === c.slug)!.shard);
  });

  it('when a part number is typed, then the shards holding it and few others are needed', () => {
    const number = docs[3].partNumbers[0];
    const { route } = sharded({ q: number });
    if (route.browse) throw new Error('a query is never answered from the first index alone');
    const holding = plan.shards.flatMap((s, i) => (s.documents.some((d) => d.partNumbers.includes(number)) ? [i] : []));
    expect(route.shards).toEqual(expect.arrayContaining(holding));
    // the number's pieces may meet in a shard without meeting in one swap
    expect(route.shards.length).toBeLessThan(plan.shards.length / 3);
  });
});
