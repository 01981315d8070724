import { expect } from 'vitest';
import { search, type SearchIndex } from '../../../shared/search/search-engine';
import type { SearchDocument } from '../../../shared/search/search-document';
import type { SearchRequest, SearchResponse } from '../../../shared/search/search-types';
import { ShardedIndex } from '../../../src/features/search/worker/sharded-index';
import { servePieces } from '../../bench/support/index-pieces';

// The reader's browser answers from the first index and the shards a request needs, through the
// worker's own loading code; once they are in, its answer must be the whole index's.

/** The worker's index over `docs` served in pieces; `shardTarget` 1 puts every model in a shard of its own. */
export function shardedOver(docs: SearchDocument[], shardTarget = 1) {
  const catalogue = [...new Map(docs.map((d) => [d.chassis.slug, d.chassis])).values()];
  const served = servePieces(docs, catalogue, shardTarget);
  return { ...served, index: new ShardedIndex(() => undefined, served.fetchPart) };
}

const nested = (r: SearchRequest) => ['make', 'model', 'chassis'].some((k) => k in (r.filters ?? {}));

/** Asks both and compares everything a reader sees: results in order, scores, counts and facets. */
export async function expectSameWhenSharded(whole: SearchIndex, sharded: ShardedIndex, request: SearchRequest) {
  const expected: SearchResponse = search(whole, request);
  const { pending, ...answer } = await sharded.answer(request, { complete: true });
  const label = JSON.stringify(request);
  expect(pending, label).toBe(0);
  expect(
    answer.hits.map((h) => [h.doc.id, h.score]),
    label,
  ).toEqual(expected.hits.map((h) => [h.doc.id, h.score]));
  expect([answer.total, answer.matchedAll, answer.words, answer.sort], label).toEqual([
    expected.total,
    expected.matchedAll,
    expected.words,
    expected.sort,
  ]);
  // with a make, model or chassis chosen only that part is loaded: other makes' and models' counts stay unknown
  if (nested(request)) {
    const { make: _m, model: _o, ...rest } = expected.facets;
    expect(answer.facets, label).toMatchObject(rest);
    for (const key of ['make', 'model'] as const)
      for (const v of answer.facets[key]) expect(expected.facets[key], label).toContainEqual(v);
    expect(answer.relax, label).toEqual(expected.relax.filter((r) => !['make', 'model', 'chassis'].includes(r.filter)));
  } else {
    expect(answer.facets, label).toEqual(expected.facets);
    expect(answer.relax, label).toEqual(expected.relax);
  }
}
