import { foldTerm } from './normalise';
import type { SearchDocument } from './search-document';
import { buildIndex, search } from './search-engine';
import { searchPageSize, type SearchResponse } from './search-types';
import { encodeShards } from './shard-bits';
import { fields } from './search-fields';
import { documentTerms, isCodeTerm, type IndexStats } from './term-index';

// The index in pieces: a small first index that every reader loads, and the documents in shards
// fetched when a query or filter needs them. Built by the server (and the benchmark) from the same
// documents `GET /api/search-index` sends whole.

/** A shard holds one make's swaps, or part of them: whole models, up to about this many swaps. */
export const shardTargetDocs = 400;

/** `hash` is of the shard's content: its address changes with it, so a copy may be kept for a year */
export type ShardInfo = { id: string; count: number; hash: string };
export type HeadChassis = SearchDocument['chassis'] & {
  /** approved swaps on this chassis */
  count: number;
  /** index into `shards`; null while it has no approved swap */
  shard: number | null;
};

/** What a reader loads first: enough to route any query to the shards that can answer it. */
export type SearchHead = {
  /** changes with any shard: the code tables route to shards by their place in `shards`, so they are addressed by it */
  generation: string;
  documentCount: number;
  /** the whole collection's figures, so a partly loaded index scores like the whole */
  stats: IndexStats;
  shards: ShardInfo[];
  /** every chassis of the catalogue, with or without swaps */
  chassis: HeadChassis[];
  /** every word without a digit → the shards holding it (`encodeShards`), ":", the swaps holding it */
  words: Record<string, string>;
  /** page one without words or filters, in each order */
  browse: { newest: SearchResponse; fitted: SearchResponse };
  /** the one currency all costs are in, or null when they differ */
  currency: string | null;
};
export type SearchShard = { id: string; documents: SearchDocument[] };
/** terms with a digit (codes, part numbers, sizes) starting with `key` → shards and swaps holding them, as in `words` */
export type SearchTerms = { generation: string; key: string; terms: Record<string, string> };

/** Terms with a digit are looked up by their first two characters. */
export const termKey = (term: string) => Array.from(term).slice(0, 2).join('');

const slugOf = (s: string) =>
  foldTerm(s)
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '') || 'other';
const byText = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

export type ShardPlan = {
  shards: SearchShard[];
  stats: IndexStats;
  shardOfChassis: Map<string, number>;
  words: Record<string, string>;
  chunks: Map<string, Record<string, string>>;
};

export function planShards(docs: SearchDocument[], target = shardTargetDocs): ShardPlan {
  const makes = new Map<string, Map<string, SearchDocument[]>>();
  for (const d of docs) {
    const models = makes.get(d.chassis.make) ?? new Map<string, SearchDocument[]>();
    makes.set(d.chassis.make, models);
    const list = models.get(d.chassis.model) ?? [];
    models.set(d.chassis.model, list);
    list.push(d);
  }
  const shards: SearchShard[] = [];
  const used = new Set<string>();
  const open = (base: string) => {
    let id = base;
    for (let n = 2; used.has(id); n++) id = `${base}-${n}`;
    used.add(id);
    shards.push({ id, documents: [] });
  };
  for (const make of [...makes.keys()].sort(byText)) {
    const models = makes.get(make)!;
    const total = [...models.values()].reduce((n, l) => n + l.length, 0);
    const base = slugOf(make);
    let part = 0;
    let current: SearchDocument[] | null = null;
    for (const model of [...models.keys()].sort(byText)) {
      const list = models.get(model)!;
      if (current === null || (current.length > 0 && current.length + list.length > target)) {
        open(total <= target ? base : `${base}-${++part}`);
        current = shards[shards.length - 1].documents;
      }
      current.push(...list);
    }
  }
  for (const s of shards) s.documents.sort((a, b) => a.id - b.id);

  const shardOfChassis = new Map<string, number>();
  const where = new Map<string, { shards: Set<number>; docs: number }>();
  const lengthSum = new Float64Array(fields.length);
  shards.forEach((s, i) => {
    for (const d of s.documents) {
      shardOfChassis.set(d.chassis.slug, i);
      const terms = documentTerms(d);
      terms.forEach((t, f) => (lengthSum[f] += new Set(t).size));
      for (const t of new Set(terms.flat())) {
        let entry = where.get(t);
        if (!entry) where.set(t, (entry = { shards: new Set(), docs: 0 }));
        entry.shards.add(i);
        entry.docs++;
      }
    }
  });
  const words: Record<string, string> = {};
  const chunks = new Map<string, Record<string, string>>();
  for (const term of [...where.keys()].sort(byText)) {
    const { shards: holding, docs: n } = where.get(term)!;
    const bits = `${encodeShards(holding, shards.length)}:${n}`;
    if (!isCodeTerm(term)) words[term] = bits;
    else {
      const key = termKey(term);
      const chunk = chunks.get(key) ?? {};
      chunks.set(key, chunk);
      chunk[term] = bits;
    }
  }
  const stats = {
    documentCount: docs.length,
    avgFieldLength: Array.from(lengthSum, (sum) => (docs.length ? sum / docs.length : 0)),
  };
  return { shards, stats, shardOfChassis, words, chunks };
}

export function assembleHead(input: {
  plan: ShardPlan;
  hashes: string[];
  generation: string;
  catalogue: SearchDocument['chassis'][];
  browse: SearchHead['browse'];
}): SearchHead {
  const { plan, hashes } = input;
  const counts = new Map<string, number>();
  const currencies = new Set<string>();
  const chassis = new Map(input.catalogue.map((c) => [c.slug, c]));
  for (const s of plan.shards)
    for (const d of s.documents) {
      counts.set(d.chassis.slug, (counts.get(d.chassis.slug) ?? 0) + 1);
      if (!chassis.has(d.chassis.slug)) chassis.set(d.chassis.slug, d.chassis);
      if (d.cost) currencies.add(d.cost.currency);
    }
  return {
    generation: input.generation,
    documentCount: plan.stats.documentCount,
    stats: plan.stats,
    shards: plan.shards.map((s, i) => ({ id: s.id, count: s.documents.length, hash: hashes[i] })),
    chassis: [...chassis.values()].map((c) => ({
      ...c,
      count: counts.get(c.slug) ?? 0,
      shard: plan.shardOfChassis.get(c.slug) ?? null,
    })),
    words: plan.words,
    browse: input.browse,
    currency: currencies.size === 1 ? [...currencies][0] : null,
  };
}

/** Everything a reader may fetch, as the server sends it: shard bodies are JSON text, hashed for their addresses. */
export type IndexPieces = {
  head: SearchHead;
  shards: { id: string; hash: string; json: string }[];
  /** the code tables by key; a key not here has an empty table */
  terms: Map<string, SearchTerms>;
};

/**
 * Splits the documents and builds the first index over them. `hashOf` gives a short hash of a text
 * (the server's, so this module needs no crypto of its own): a shard's address carries the hash of
 * its body, and the code tables' addresses the hash of the whole shard list (`generation`), since
 * they route by places in that list.
 */
export function buildPieces(
  docs: SearchDocument[],
  catalogue: SearchDocument['chassis'][],
  hashOf: (text: string) => string,
  target = shardTargetDocs,
): IndexPieces {
  const plan = planShards(docs, target);
  const shards = plan.shards.map((s) => {
    const json = JSON.stringify(s);
    return { id: s.id, hash: hashOf(json), json };
  });
  const generation = hashOf(shards.map((s) => `${s.id}/${s.hash}`).join(' '));
  const head = assembleHead({
    plan,
    hashes: shards.map((s) => s.hash),
    generation,
    catalogue,
    browse: browseAnswers(docs),
  });
  const terms = new Map([...plan.chunks].map(([key, entries]) => [key, { generation, key, terms: entries }]));
  return { head, shards, terms };
}

/** The answers the first index carries: page one of everything, newest first and most fitted first. */
export function browseAnswers(docs: SearchDocument[]): SearchHead['browse'] {
  const index = buildIndex(docs, { text: false });
  return {
    newest: search(index, { sort: 'newest', limit: searchPageSize }),
    fitted: search(index, { sort: 'fitted', limit: searchPageSize }),
  };
}
