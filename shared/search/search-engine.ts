import { parseClauses } from './query';
import type { SearchDocument } from './search-document';
import { allowedCodes, FacetIndex, facetValues, relaxTotals, tally } from './facets';
import type { Hits } from './hits';
import { rankPage } from './ranking';
import { Scorer } from './scorer';
import { TermIndex, type IndexStats } from './term-index';
import { cleanFilters, type SearchRequest, type SearchResponse, type SearchSort } from './search-types';

// The search over approved swaps: one pure module used by the browser's worker, the server's first
// index, the benchmark and the tests. Documents can arrive in batches (shards); positions are the
// order they arrived in.

export type SearchIndex = {
  docs: SearchDocument[];
  text: TermIndex;
  facets: FacetIndex;
  scorer: Scorer;
  /** positions, newest first / most fitted first, and each position's rank in those orders */
  newest: Int32Array;
  fitted: Int32Array;
  newestRank: Int32Array;
  fittedRank: Int32Array;
};

const newestFirst = (a: SearchDocument, b: SearchDocument) =>
  a.updatedAt < b.updatedAt ? 1 : a.updatedAt > b.updatedAt ? -1 : b.id - a.id;
const mostFitted = (a: SearchDocument, b: SearchDocument) => b.fittedCount - a.fittedCount || newestFirst(a, b);

/**
 * An empty index. `stats` are the whole collection's figures when only part of it will be loaded,
 * so scores do not depend on which shards happen to be in memory; without them, the loaded documents count.
 */
export function createIndex(stats?: IndexStats): SearchIndex {
  const text = new TermIndex(stats ?? null);
  const index: SearchIndex = {
    docs: [],
    text,
    facets: new FacetIndex(),
    scorer: new Scorer(text),
    newest: new Int32Array(0),
    fitted: new Int32Array(0),
    newestRank: new Int32Array(0),
    fittedRank: new Int32Array(0),
  };
  return index;
}

/** Merges the sorted new positions into a sorted order in one pass. */
function mergeOrder(order: Int32Array, added: number[], docs: SearchDocument[], cmp: typeof newestFirst) {
  added.sort((a, b) => cmp(docs[a], docs[b]));
  const out = new Int32Array(order.length + added.length);
  let i = 0;
  let j = 0;
  let k = 0;
  while (i < order.length && j < added.length) out[k++] = cmp(docs[order[i]], docs[added[j]]) <= 0 ? order[i++] : added[j++];
  while (i < order.length) out[k++] = order[i++];
  while (j < added.length) out[k++] = added[j++];
  const rank = new Int32Array(out.length);
  out.forEach((p, r) => (rank[p] = r));
  return [out, rank] as const;
}

export function addDocuments(index: SearchIndex, docs: SearchDocument[], { text = true } = {}) {
  const base = index.docs.length;
  for (const d of docs) index.docs.push(d);
  if (text) index.text.add(docs);
  index.facets.add(docs);
  const added = docs.map((_, i) => base + i);
  [index.newest, index.newestRank] = mergeOrder(index.newest, [...added], index.docs, newestFirst);
  [index.fitted, index.fittedRank] = mergeOrder(index.fitted, added, index.docs, mostFitted);
}

/** `text: false` builds only what browsing needs (orders and facets): no query can be answered. */
export function buildIndex(docs: SearchDocument[], options: { text?: boolean } = {}): SearchIndex {
  const index = createIndex();
  addDocuments(index, docs, options);
  return index;
}

export type Matched = {
  hits: Hits;
  /** clauses in the query: words, or trade phrases counted once */
  words: number;
  /** by position, how many clauses the document matches (null for a one-clause query) */
  found: Uint8Array | null;
};

/** Documents matching any clause of the query, with how many each matches. Null for no query. */
export function matchQuery(index: SearchIndex, q: string): Matched | null {
  const clauses = parseClauses(q);
  if (clauses.length === 0) return null;
  const { scorer } = index;
  const perClause = clauses.map((c) => scorer.clause(c));
  if (perClause.length === 1) return { hits: perClause[0], words: 1, found: null };
  const { hits, found, rest } = scorer.union(perClause);
  rest.forEach((h) => scorer.give(h));
  return { hits, words: clauses.length, found };
}

/** Hands a match's buffers back for reuse. */
export function releaseMatch(index: SearchIndex, m: Matched | null) {
  if (m) index.scorer.give(m.hits);
}

/** Query, filter, count facets, sort and page. */
export function search(index: SearchIndex, request: SearchRequest = {}): SearchResponse {
  const filters = cleanFilters(request.filters ?? {});
  const q = request.q?.trim() ?? '';
  const matched = q ? matchQuery(index, q) : null;
  const sort: SearchSort = request.sort ?? (matched ? 'relevance' : 'newest');
  const offset = Math.max(0, request.offset ?? 0);
  const limit = Math.max(0, Math.min(request.limit ?? 20, 200));

  const candidates: Int32Array = matched ? matched.hits.matched() : sort === 'fitted' ? index.fitted : index.newest;
  const counted = tally(index.facets, candidates, matched?.hits ?? null, allowedCodes(index.facets, filters));
  const { passing } = counted;

  // swaps matching more of the query's words come first, whatever the order within them
  const rank = sort === 'fitted' ? index.fittedRank : index.newestRank;
  const { page, matchedAll } = !matched
    ? { page: Array.from(passing.subarray(0, offset + limit)), matchedAll: passing.length }
    : rankPage(passing, offset + limit, matched.words, {
        found: matched.found,
        score: sort === 'relevance' ? matched.hits.score : null,
        rank,
      });
  const hits = page.slice(offset).map((p) => ({ doc: index.docs[p], score: matched ? matched.hits.score[p] : null }));
  const response: SearchResponse = {
    documentCount: index.docs.length,
    total: passing.length,
    words: matched?.words ?? 0,
    matchedAll,
    hits,
    facets: facetValues(index.facets, filters, counted.counts),
    relax: relaxTotals(filters, counted),
    sort,
  };
  releaseMatch(index, matched);
  return response;
}
