import MiniSearch, { type Options, type Query, type SearchOptions } from 'minisearch';
import {
  axles,
  categories,
  categoryLabels,
  machiningLevelLabels,
  machiningLevels,
  type Axle,
  type Category,
  type MachiningLevel,
} from '../schemas/enums';
import { parseQuery, processTerm, tokenize, chunkPieces } from './normalise';
import type { SearchDocument } from './search-document';

// The search over approved swaps: one pure module used by the browser's worker, the benchmark and the tests.

export const searchSorts = ['relevance', 'newest', 'fitted'] as const;
export type SearchSort = (typeof searchSorts)[number];

export const costBuckets = [
  { value: 'u250', minMinor: 0, maxMinor: 25_000 },
  { value: '250-500', minMinor: 25_000, maxMinor: 50_000 },
  { value: '500-1000', minMinor: 50_000, maxMinor: 100_000 },
  { value: '1000-2000', minMinor: 100_000, maxMinor: 200_000 },
  { value: '2000+', minMinor: 200_000, maxMinor: Infinity },
] as const;
export type CostBucket = (typeof costBuckets)[number]['value'];

export type SearchFilters = {
  make?: string;
  model?: string;
  /** chassis slug */
  chassis?: string;
  axle?: Axle;
  category?: Category;
  /** the reader's wheel diameter in inches: swaps whose minimum wheel is at most this (or that set none) */
  wheel?: number;
  machining?: MachiningLevel;
  parkingBrake?: 'yes' | 'no';
  /** bucket of the cheapest route total */
  cost?: CostBucket;
};
export type FilterKey = keyof SearchFilters;
export const filterKeys = [
  'make',
  'model',
  'chassis',
  'axle',
  'category',
  'wheel',
  'machining',
  'parkingBrake',
  'cost',
] as const satisfies readonly FilterKey[];

export type SearchRequest = { q?: string; filters?: SearchFilters; sort?: SearchSort; offset?: number; limit?: number };
export type FacetValue = { value: string; label: string; count: number };
export type SearchFacets = Record<FilterKey, FacetValue[]>;
export type SearchHit = { doc: SearchDocument; score: number | null };
export type SearchResponse = {
  /** documents in the index */
  documentCount: number;
  /** results after the query and every filter */
  total: number;
  /** true when no swap matched every word, and these match some of them */
  relaxed: boolean;
  hits: SearchHit[];
  facets: SearchFacets;
  /** for each active filter, how many results there would be without it */
  relax: { filter: FilterKey; total: number }[];
  sort: SearchSort;
};

type Field = 'code' | 'model' | 'make' | 'partNumbers' | 'title' | 'partNames' | 'adapter' | 'cameOn' | 'tags';
const fields: Field[] = ['code', 'model', 'make', 'partNumbers', 'title', 'partNames', 'adapter', 'cameOn', 'tags'];

/** Chassis and part matches rank above the title, the title above the rest. */
export const fieldBoosts: Record<Field, number> = {
  code: 10,
  model: 8,
  partNumbers: 6,
  make: 3,
  title: 2,
  partNames: 1.2,
  adapter: 1,
  cameOn: 0.8,
  tags: 0.5,
};

function extractField(doc: SearchDocument, field: string): string | number {
  switch (field as Field | 'id') {
    case 'code':
      return doc.chassis.code;
    case 'model':
      return doc.chassis.model;
    case 'make':
      return doc.chassis.make;
    case 'partNumbers':
      return doc.adapter?.partNumber ? [...doc.partNumbers, doc.adapter.partNumber].join(' ') : doc.partNumbers.join(' ');
    case 'title':
      return doc.title;
    case 'partNames':
      return doc.partNames.join(' ');
    case 'adapter':
      return doc.adapter ? `${doc.adapter.name} ${doc.adapter.maker}` : '';
    case 'cameOn':
      return doc.cameOn.join(' ');
    case 'tags':
      return `${doc.axle} axle ${categoryLabels[doc.category]}`;
    case 'id':
      return doc.id;
  }
}

const hasDigit = /\d/;
const hasLetter = /\p{L}/u;

/** Typos are forgiven on words of four letters or more, and by one character on short codes that mix letters and digits (h3l → h31). */
export function fuzzyFor(term: string): number | false {
  if (hasDigit.test(term)) return hasLetter.test(term) && term.length >= 3 && term.length <= 5 ? 1 : false;
  return term.length >= 4 ? 0.2 : false;
}

export const searchOptions: SearchOptions = {
  boost: fieldBoosts,
  prefix: (term) => term.length >= 2,
  fuzzy: (term) => fuzzyFor(term),
  maxFuzzy: 2,
  combineWith: 'AND',
  tokenize: chunkPieces,
  processTerm,
};

export const indexOptions: Options<SearchDocument> = {
  idField: 'id',
  fields,
  storeFields: [],
  extractField,
  tokenize,
  processTerm,
  searchOptions,
};

// ---------------------------------------------------------------------------------------------
// Scoring. minisearch tokenizes, stores the term tree (fuzzy lookups) and serializes; answering a
// query goes over a flat copy of its postings in typed arrays, because minisearch's own search
// builds an object per matching document and sorts them all, and even walking its Map postings
// costs milliseconds on a word like "caliper" that most swaps contain.

type FieldTermData = Map<number, Map<number, number>>;
type TermTree = Iterable<[string, FieldTermData]> & {
  fuzzyGet(term: string, maxDistance: number): Map<string, [FieldTermData, number]>;
};
/** the parts of minisearch's state the scorer reads; kept protected by the library */
type MiniInternals = {
  _index: TermTree;
  _documentIds: Map<number, number>;
  _fieldIds: Record<string, number>;
  _fieldLength: Map<number, number[]>;
  _avgFieldLength: number[];
  _documentCount: number;
  _nextId: number;
};

const BM25 = { k: 1.2, b: 0.7, d: 0.5 };
const PREFIX_WEIGHT = 0.375;
const FUZZY_WEIGHT = 0.45;
const chassisFields: Field[] = ['code', 'model', 'make'];

/** Sparse score accumulator over document positions; a score of 0 means "not matched" (every match adds more than 0). */
class Hits {
  readonly score: Float64Array;
  /** matched positions in the order they were first scored; only the first `count` are live */
  readonly ids: Int32Array;
  count = 0;
  constructor(size: number) {
    this.score = new Float64Array(size);
    this.ids = new Int32Array(size);
  }
  add(p: number, s: number) {
    if (this.score[p] === 0) this.ids[this.count++] = p;
    this.score[p] += s;
  }
  matched(): Int32Array {
    return this.ids.subarray(0, this.count);
  }
  clear() {
    for (let i = 0; i < this.count; i++) this.score[this.ids[i]] = 0;
    this.count = 0;
  }
}

/**
 * Every term of the index in code-unit order, each with one posting list per field it occurs in,
 * all flattened into typed arrays once at index time. A prefix is then a contiguous run of terms
 * found by binary search, and a posting list two array slices (positions and term frequencies).
 * Costs 6 bytes a posting beside minisearch's own maps (some 23 MB at 50,000 swaps).
 */
class Postings {
  readonly terms: string[];
  /** per term, its first list; term t owns lists firstList[t] … firstList[t + 1] − 1 */
  readonly firstList: Uint32Array;
  readonly listField: Uint8Array;
  /** inverse document frequency of each (term, field), counted as minisearch counts it */
  readonly listIdf: Float64Array;
  /** list l covers postings listStart[l] … listStart[l + 1] − 1 */
  readonly listStart: Uint32Array;
  readonly position: Int32Array;
  readonly tf: Uint16Array;

  constructor(tree: TermTree, toPosition: Int32Array, total: number) {
    const entries: [string, FieldTermData][] = [...tree];
    entries.sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
    let lists = 0;
    let postings = 0;
    for (const [, data] of entries) {
      lists += data.size;
      for (const list of data.values()) postings += list.size;
    }
    this.terms = entries.map((e) => e[0]);
    this.firstList = new Uint32Array(entries.length + 1);
    this.listField = new Uint8Array(lists);
    this.listIdf = new Float64Array(lists);
    this.listStart = new Uint32Array(lists + 1);
    this.position = new Int32Array(postings);
    this.tf = new Uint16Array(postings);
    let l = 0;
    let i = 0;
    entries.forEach(([, data], t) => {
      this.firstList[t] = l;
      for (const [fieldId, list] of data) {
        const n = list.size;
        this.listField[l] = fieldId;
        this.listIdf[l] = Math.log(1 + (total - n + 0.5) / (n + 0.5));
        this.listStart[l] = i;
        for (const [shortId, tf] of list) {
          const p = toPosition[shortId];
          if (p < 0) continue;
          this.position[i] = p;
          this.tf[i++] = tf;
        }
        l++;
      }
    });
    this.firstList[entries.length] = l;
    this.listStart[l] = i;
  }

  /** the first term ≥ `term` */
  lowerBound(term: string): number {
    let lo = 0;
    let hi = this.terms.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (this.terms[mid] < term) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  }

  find(term: string): number {
    const t = this.lowerBound(term);
    return this.terms[t] === term ? t : -1;
  }
}

class Scorer {
  private readonly postings: Postings;
  private readonly tree: TermTree;
  /** per field id: k·(1 − b + b·len/avg) by document position */
  private readonly norm: Float32Array[];
  private readonly boostById: Float64Array;
  private readonly chassisMask: number;
  private readonly allMask: number;
  private readonly pool: Hits[] = [];
  readonly size: number;

  constructor(mini: MiniSearch<SearchDocument>, position: Map<number, number>) {
    const m = mini as unknown as MiniInternals;
    this.tree = m._index;
    this.size = position.size;
    const toPosition = new Int32Array(m._nextId).fill(-1);
    for (const [shortId, id] of m._documentIds) toPosition[shortId] = position.get(id) ?? -1;
    const fieldCount = Object.keys(m._fieldIds).length;
    this.norm = Array.from({ length: fieldCount }, () => new Float32Array(this.size));
    for (const [shortId, lengths] of m._fieldLength) {
      const p = toPosition[shortId];
      if (p < 0) continue;
      for (let f = 0; f < fieldCount; f++) {
        const avg = m._avgFieldLength[f] || 1;
        this.norm[f][p] = BM25.k * (1 - BM25.b + (BM25.b * (lengths[f] ?? 0)) / avg);
      }
    }
    this.boostById = new Float64Array(fieldCount);
    for (const [field, id] of Object.entries(m._fieldIds)) this.boostById[id] = fieldBoosts[field as Field] ?? 1;
    this.chassisMask = chassisFields.reduce((mask, f) => mask | (1 << m._fieldIds[f]), 0);
    this.allMask = (1 << fieldCount) - 1;
    this.postings = new Postings(this.tree, toPosition, m._documentCount);
  }

  take(): Hits {
    return this.pool.pop() ?? new Hits(this.size);
  }
  give(h: Hits) {
    h.clear();
    this.pool.push(h);
  }

  /** BM25 of one term (by its index in `postings`) in the fields of `fieldMask`, times `weight` */
  private addTerm(t: number, weight: number, fieldMask: number, into: Hits) {
    if (t < 0) return;
    const { firstList, listField, listIdf, listStart, position, tf } = this.postings;
    const { score, ids } = into;
    let count = into.count;
    for (let l = firstList[t]; l < firstList[t + 1]; l++) {
      const fieldId = listField[l];
      if (!(fieldMask & (1 << fieldId))) continue;
      const w = weight * this.boostById[fieldId] * listIdf[l];
      const norm = this.norm[fieldId];
      // Hits.add by hand: this loop runs once per posting of every matched term
      for (let i = listStart[l]; i < listStart[l + 1]; i++) {
        const p = position[i];
        const f = tf[i];
        if (score[p] === 0) ids[count++] = p;
        score[p] += w * (BM25.d + (f * (BM25.k + 1)) / (f + norm[p]));
      }
    }
    into.count = count;
  }

  /** exact, then prefix (from two characters; two-character prefixes only on make, model and code) */
  private addWord(term: string, into: Hits) {
    const { terms } = this.postings;
    const first = this.postings.lowerBound(term);
    if (terms[first] === term) this.addTerm(first, 1, this.allMask, into);
    if (term.length < 2) return;
    const mask = term.length === 2 ? this.chassisMask : this.allMask;
    for (let t = first; t < terms.length && terms[t].startsWith(term); t++) {
      const length = terms[t].length;
      const distance = length - term.length;
      if (distance === 0) continue;
      this.addTerm(t, (PREFIX_WEIGHT * length) / (length + 0.3 * distance), mask, into);
    }
  }

  private addFuzzy(term: string, into: Hits) {
    const fuzzy = fuzzyFor(term);
    if (!fuzzy) return;
    const maxDistance = fuzzy < 1 ? Math.min(2, Math.round(term.length * fuzzy)) : fuzzy;
    if (!maxDistance) return;
    for (const [t, [, distance]] of this.tree.fuzzyGet(term, maxDistance)) {
      if (distance === 0) continue;
      this.addTerm(this.postings.find(t), (FUZZY_WEIGHT * t.length) / (t.length + distance), this.allMask, into);
    }
  }

  /**
   * One whitespace-separated chunk: its joined form, or all of its pieces (`ov-355` → `ov355…` or ov ∧ 355).
   * Typos are looked for only when the chunk matches nothing as typed: fuzzy matching is slow on a
   * large vocabulary and pulls in near-misses (rotor → motor) that the reader did not ask for.
   */
  chunk(pieces: string[]): Hits {
    const joined = pieces.join('');
    const hits = this.take();
    this.addWord(joined, hits);
    if (pieces.length > 1) {
      const parts = pieces.map((p) => {
        const h = this.take();
        this.addWord(p, h);
        return h;
      });
      const both = this.intersect(parts);
      parts.forEach((h) => this.give(h));
      for (let i = 0; i < both.count; i++) {
        const p = both.ids[i];
        hits.add(p, both.score[p]);
      }
      this.give(both);
    }
    if (hits.count === 0) this.addFuzzy(joined, hits);
    return hits;
  }

  /** documents in every set, scores summed in the sets' order; the inputs stay with the caller */
  intersect(sets: Hits[]): Hits {
    const out = this.take();
    if (sets.length === 0) return out;
    const smallest = sets.reduce((a, b) => (a.count <= b.count ? a : b));
    for (let i = 0; i < smallest.count; i++) {
      const p = smallest.ids[i];
      let s = 0;
      let all = true;
      for (const h of sets) {
        const v = h.score[p];
        if (v === 0) {
          all = false;
          break;
        }
        s += v;
      }
      if (all) out.add(p, s);
    }
    return out;
  }

  /** documents in any set, scores summed; the inputs stay with the caller */
  union(sets: Hits[]): Hits {
    const out = this.take();
    for (const h of sets) {
      for (let i = 0; i < h.count; i++) {
        const p = h.ids[i];
        out.add(p, h.score[p]);
      }
    }
    return out;
  }
}

// ---------------------------------------------------------------------------------------------
// Facets: every facet value is a small integer per document (0 = not given), counted in typed arrays.

const groups = [
  'make',
  'model',
  'chassis',
  'axle',
  'category',
  'wheel',
  'machining',
  'parkingBrake',
  'cost',
] as const satisfies readonly FilterKey[];
type Group = (typeof groups)[number];

type Codes = { values: string[]; code: Map<string, number>; byDoc: Uint32Array };

function encode(docs: SearchDocument[], valueOf: (d: SearchDocument) => string | null, order?: readonly string[]): Codes {
  const values = [''];
  const code = new Map<string, number>();
  for (const v of order ?? []) code.set(v, values.push(v) - 1);
  const byDoc = new Uint32Array(docs.length);
  docs.forEach((d, i) => {
    const v = valueOf(d);
    if (v === null) return;
    let c = code.get(v);
    if (c === undefined) code.set(v, (c = values.push(v) - 1));
    byDoc[i] = c;
  });
  return { values, code, byDoc };
}

/**
 * Every document's facet codes side by side (document p, group g at p·G + g), each shifted into one
 * code space shared by all groups, so counting a document is nine `counts[code]++` on adjacent entries.
 */
type FacetTable = {
  /** group g owns shared codes offset[g] … offset[g + 1] − 1 */
  offset: Int32Array;
  codes: Uint16Array | Uint32Array;
  /** counts over every document, for browsing without a query or filter */
  all: Int32Array;
};
const G = groups.length;

function facetTable(codes: Record<Group, Codes>, size: number): FacetTable {
  const offset = new Int32Array(G + 1);
  groups.forEach((g, i) => (offset[i + 1] = offset[i] + codes[g].values.length));
  const table = offset[G] <= 0xffff ? new Uint16Array(size * G) : new Uint32Array(size * G);
  groups.forEach((g, i) => {
    const byDoc = codes[g].byDoc;
    for (let p = 0; p < size; p++) table[p * G + i] = offset[i] + byDoc[p];
  });
  const all = new Int32Array(offset[G]);
  for (let j = 0; j < table.length; j++) all[table[j]]++;
  return { offset, codes: table, all };
}

export type SearchIndex = {
  mini: MiniSearch<SearchDocument>;
  docs: SearchDocument[];
  position: Map<number, number>;
  scorer: Scorer;
  codes: Record<Group, Codes>;
  facets: FacetTable;
  /** positions, newest first / most fitted first */
  newest: Int32Array;
  fitted: Int32Array;
  newestRank: Int32Array;
  fittedRank: Int32Array;
  wheelSizes: number[];
  chassisLabels: Map<string, { make: string; model: string; label: string }>;
};

export function costBucketOf(minMinor: number): CostBucket {
  return costBuckets.find((b) => minMinor >= b.minMinor && minMinor < b.maxMinor)!.value;
}

const newestFirst = (a: SearchDocument, b: SearchDocument) =>
  a.updatedAt < b.updatedAt ? 1 : a.updatedAt > b.updatedAt ? -1 : b.id - a.id;
const SEP = '\u0000';

/** Orders, facet codes and labels around an index; `mini` is either freshly built or loaded from JSON. */
function wrap(mini: MiniSearch<SearchDocument>, docs: SearchDocument[]): SearchIndex {
  const positions = docs.map((_, i) => i);
  const newest = Int32Array.from([...positions].sort((a, b) => newestFirst(docs[a], docs[b])));
  const fitted = Int32Array.from(
    [...positions].sort((a, b) => docs[b].fittedCount - docs[a].fittedCount || newestFirst(docs[a], docs[b])),
  );
  const newestRank = new Int32Array(docs.length);
  newest.forEach((p, rank) => (newestRank[p] = rank));
  const fittedRank = new Int32Array(docs.length);
  fitted.forEach((p, rank) => (fittedRank[p] = rank));
  const chassisLabels = new Map<string, { make: string; model: string; label: string }>();
  for (const { chassis: c } of docs) {
    if (!chassisLabels.has(c.slug))
      chassisLabels.set(c.slug, { make: c.make, model: c.model, label: `${c.code} (${c.yearFrom}–${c.yearTo ?? 'on'})` });
  }
  const wheelSizes = [...new Set(docs.map((d) => d.minWheelIn).filter((w): w is number => w !== null))].sort((a, b) => a - b);
  const position = new Map(docs.map((d, i) => [d.id, i]));
  const codes: Record<Group, Codes> = {
    make: encode(docs, (d) => d.chassis.make),
    model: encode(docs, (d) => d.chassis.make + SEP + d.chassis.model),
    chassis: encode(docs, (d) => d.chassis.slug),
    axle: encode(docs, (d) => d.axle, axles),
    category: encode(docs, (d) => d.category, categories),
    wheel: encode(docs, (d) => (d.minWheelIn === null ? null : String(d.minWheelIn)), wheelSizes.map(String)),
    machining: encode(docs, (d) => d.machining, machiningLevels),
    parkingBrake: encode(docs, (d) => (d.parkingBrakeKept === null ? null : d.parkingBrakeKept ? 'yes' : 'no'), ['yes', 'no']),
    cost: encode(
      docs,
      (d) => (d.cost ? costBucketOf(d.cost.min) : null),
      costBuckets.map((b) => b.value),
    ),
  };
  return {
    mini,
    docs,
    position,
    scorer: new Scorer(mini, position),
    codes,
    facets: facetTable(codes, docs.length),
    newest,
    fitted,
    newestRank,
    fittedRank,
    wheelSizes,
    chassisLabels,
  };
}

export function buildIndex(docs: SearchDocument[]): SearchIndex {
  const mini = new MiniSearch<SearchDocument>(indexOptions);
  mini.addAll(docs);
  return wrap(mini, docs);
}

/** Rebuilds the search structure from `JSON.stringify(index.mini)` and the documents it was built from. */
export function loadIndex(json: string, docs: SearchDocument[]): SearchIndex {
  return wrap(MiniSearch.loadJSON<SearchDocument>(json, indexOptions), docs);
}

/** The same query as a minisearch expression, for comparing with its own search (the benchmark does). */
export function queryTree(q: string, combineWith: 'AND' | 'OR' = 'AND'): Query | null {
  const chunks = parseQuery(q);
  if (chunks.reduce((n, c) => n + c.join('').length, 0) < 2) return null;
  const queries: Query[] = chunks.map((pieces) =>
    pieces.length === 1 ? pieces[0] : { combineWith: 'OR', queries: [pieces.join(''), { combineWith: 'AND', queries: pieces }] },
  );
  return { combineWith, queries };
}

export type Matched = { hits: Hits; relaxed: boolean };

/** Every chunk must match; when nothing has them all, any chunk will do (and the answer says so). Null for no query. */
export function matchQuery(index: SearchIndex, q: string): Matched | null {
  const chunks = parseQuery(q);
  if (chunks.reduce((n, c) => n + c.join('').length, 0) < 2) return null;
  const { scorer } = index;
  const perChunk = chunks.map((c) => scorer.chunk(c));
  if (perChunk.length === 1) return { hits: perChunk[0], relaxed: false };
  let hits = scorer.intersect(perChunk);
  const relaxed = hits.count === 0;
  if (relaxed) {
    scorer.give(hits);
    hits = scorer.union(perChunk);
  }
  perChunk.forEach((h) => scorer.give(h));
  return { hits, relaxed: relaxed && hits.count > 0 };
}

/** Hands a match's buffers back for reuse. */
export function releaseMatch(index: SearchIndex, m: Matched | null) {
  if (m) index.scorer.give(m.hits);
}

/** The k best positions by `better` (a strict order), best first, without sorting everything. */
function topK(ids: ArrayLike<number>, k: number, better: (a: number, b: number) => boolean): number[] {
  const top: number[] = [];
  if (k <= 0) return top;
  for (let i = 0; i < ids.length; i++) {
    const p = ids[i];
    if (top.length === k && !better(p, top[k - 1])) continue;
    let j = top.length < k ? top.length : k - 1;
    while (j > 0 && better(p, top[j - 1])) {
      top[j] = top[j - 1];
      j--;
    }
    top[j] = p;
  }
  return top;
}

const bit: Record<Group, number> = {
  make: 1,
  model: 2,
  chassis: 4,
  axle: 8,
  category: 16,
  wheel: 32,
  machining: 64,
  parkingBrake: 128,
  cost: 256,
};
/** Filters a facet's own counts ignore: counts show what choosing another value would give. Make → model → chassis nest. */
const ignoredBy: Record<Group, number> = {
  make: bit.make | bit.model | bit.chassis,
  model: bit.model | bit.chassis,
  chassis: bit.chassis,
  axle: bit.axle,
  category: bit.category,
  wheel: bit.wheel,
  machining: bit.machining,
  parkingBrake: bit.parkingBrake,
  cost: bit.cost,
};

/** Per group, which codes pass the filter (null: no filter on that group). */
function allowedCodes(index: SearchIndex, f: SearchFilters): Record<Group, Uint8Array | null> {
  const out = {} as Record<Group, Uint8Array | null>;
  for (const g of groups) {
    const codes = index.codes[g];
    const value = f[g];
    if (value === undefined) {
      out[g] = null;
      continue;
    }
    const allowed = new Uint8Array(codes.values.length);
    codes.values.forEach((v, c) => {
      if (c === 0) allowed[c] = g === 'wheel' ? 1 : 0;
      else if (g === 'wheel') allowed[c] = Number(v) <= (value as number) ? 1 : 0;
      else if (g === 'model') allowed[c] = (f.make === undefined ? v.endsWith(SEP + value) : v === f.make + SEP + value) ? 1 : 0;
      else allowed[c] = v === value ? 1 : 0;
    });
    out[g] = allowed;
  }
  return out;
}

type Tally = { passing: Int32Array; flatCounts: Int32Array; relaxCounts: Int32Array };

/**
 * No filter: every candidate passes and counts in every group. When the match covers most of the
 * index it is cheaper to start from the counts over all documents and take away the unmatched ones
 * (one score check per document, G decrements per miss) than to add up the matched ones (G per hit).
 */
function tallyUnfiltered(table: FacetTable, candidates: Int32Array, hits: Hits | null): Tally {
  const relaxCounts = new Int32Array(G);
  const { codes } = table;
  if (hits === null) return { passing: candidates, flatCounts: table.all, relaxCounts };
  const size = hits.score.length;
  const counts = new Int32Array(table.all.length);
  if (hits.count * 2 * G > size * (G + 1)) {
    counts.set(table.all);
    const score = hits.score;
    for (let p = 0; p < size; p++) {
      if (score[p] !== 0) continue;
      for (let j = p * G; j < p * G + G; j++) counts[codes[j]]--;
    }
  } else {
    for (let i = 0; i < candidates.length; i++) {
      const base = candidates[i] * G;
      for (let j = base; j < base + G; j++) counts[codes[j]]++;
    }
  }
  return { passing: candidates, flatCounts: counts, relaxCounts };
}

/**
 * With filters: a candidate passes when no group rejects it; it counts in a group's facet when only
 * that group's own (or its nested) filters reject it; one rejecting filter means it would pass without it.
 */
function tallyFiltered(table: FacetTable, candidates: Int32Array, allowed: Record<Group, Uint8Array | null>): Tally {
  const { codes, offset } = table;
  // allowed by shared code; a group without a filter allows all its codes
  const allow = new Uint8Array(offset[G]).fill(1);
  groups.forEach((g, i) => allowed[g]?.forEach((a, c) => (allow[offset[i] + c] = a)));
  const filtered = Int32Array.from(groups.flatMap((g, i) => (allowed[g] ? [i] : [])));
  const ignore = groups.map((g) => ~ignoredBy[g]);
  const counts = new Int32Array(offset[G]);
  const relaxCounts = new Int32Array(G);
  const passing = new Int32Array(candidates.length);
  let n = 0;
  for (let i = 0; i < candidates.length; i++) {
    const p = candidates[i];
    const base = p * G;
    let mask = 0;
    for (let k = 0; k < filtered.length; k++) if (allow[codes[base + filtered[k]]] === 0) mask |= 1 << filtered[k];
    if (mask === 0) {
      passing[n++] = p;
      for (let j = base; j < base + G; j++) counts[codes[j]]++;
      continue;
    }
    if ((mask & (mask - 1)) === 0) relaxCounts[31 - Math.clz32(mask)]++;
    for (let g = 0; g < G; g++) if ((mask & ignore[g]) === 0) counts[codes[base + g]]++;
  }
  return { passing: passing.subarray(0, n), flatCounts: counts, relaxCounts };
}

const parkingLabels: Record<string, string> = { yes: 'Parking brake kept', no: 'Parking brake lost' };
const machiningLabels: Record<string, string> = machiningLevelLabels;

/** Query, filter, count facets, sort and page. */
export function search(index: SearchIndex, request: SearchRequest = {}): SearchResponse {
  const filters = cleanFilters(request.filters ?? {});
  const q = request.q?.trim() ?? '';
  const matched = q ? matchQuery(index, q) : null;
  const sort: SearchSort = request.sort ?? (matched ? 'relevance' : 'newest');
  const offset = Math.max(0, request.offset ?? 0);
  const limit = Math.max(0, Math.min(request.limit ?? 20, 200));

  const candidates: Int32Array = matched ? matched.hits.matched() : sort === 'fitted' ? index.fitted : index.newest;
  const allowed = allowedCodes(index, filters);
  const active = groups.filter((g) => allowed[g] !== null);
  const { passing, flatCounts, relaxCounts } =
    active.length === 0
      ? tallyUnfiltered(index.facets, candidates, matched?.hits ?? null)
      : tallyFiltered(index.facets, candidates, allowed);
  const counts = {} as Record<Group, Int32Array>;
  groups.forEach((g, i) => (counts[g] = flatCounts.subarray(index.facets.offset[i], index.facets.offset[i + 1])));

  let page: number[];
  if (!matched || sort === 'relevance') {
    if (matched) {
      const score = matched.hits.score;
      const newestRank = index.newestRank;
      page = topK(
        passing,
        offset + limit,
        (a, b) => score[a] > score[b] || (score[a] === score[b] && newestRank[a] < newestRank[b]),
      );
    } else page = Array.from(passing.subarray(0, offset + limit));
  } else {
    const rank = sort === 'newest' ? index.newestRank : index.fittedRank;
    page = topK(passing, offset + limit, (a, b) => rank[a] < rank[b]);
  }
  const hits = page.slice(offset).map((p) => ({ doc: index.docs[p], score: matched ? matched.hits.score[p] : null }));
  const response: SearchResponse = {
    documentCount: index.docs.length,
    total: passing.length,
    relaxed: matched?.relaxed ?? false,
    hits,
    facets: facetValues(index, filters, counts),
    relax: active.map((filter) => ({ filter, total: passing.length + relaxCounts[groups.indexOf(filter)] })),
    sort,
  };
  if (matched) index.scorer.give(matched.hits);
  return response;
}

function facetValues(index: SearchIndex, filters: SearchFilters, counts: Record<Group, Int32Array>): SearchFacets {
  const list = (g: Group, label: (v: string) => string, keep: (v: string) => boolean = () => true) => {
    const { values } = index.codes[g];
    const out: FacetValue[] = [];
    for (let c = 1; c < values.length; c++)
      if (counts[g][c] > 0 && keep(values[c])) out.push({ value: values[c], label: label(values[c]), count: counts[g][c] });
    return out;
  };
  // plain code-unit order: localeCompare is slow enough to show in a keystroke's budget
  const byCount = (xs: FacetValue[]) =>
    xs.sort((a, b) => b.count - a.count || (a.label < b.label ? -1 : a.label > b.label ? 1 : 0));

  // the nested lists only open under a chosen make (models) and a chosen model or chassis (chassis)
  const modelCounts = new Map<string, number>();
  if (filters.make !== undefined) {
    for (const m of list(
      'model',
      (v) => v,
      (v) => v.startsWith(filters.make + SEP),
    )) {
      const model = m.value.slice(m.value.indexOf(SEP) + 1);
      modelCounts.set(model, (modelCounts.get(model) ?? 0) + m.count);
    }
  }
  const picked = filters.chassis ? index.chassisLabels.get(filters.chassis) : undefined;
  const make = filters.make ?? picked?.make;
  const model = filters.model ?? picked?.model;
  const keepChassis = (slug: string) => {
    const c = index.chassisLabels.get(slug)!;
    return c.make === make && c.model === model;
  };

  // a wheel fits every swap whose minimum is at or below it, and every swap that names no minimum
  const wheelCounts = counts.wheel;
  let cumulative = wheelCounts[0];
  const wheel = index.wheelSizes.map((size, i) => {
    cumulative += wheelCounts[i + 1];
    return { value: String(size), label: `${size}″ wheels`, count: cumulative };
  });

  return {
    make: byCount(list('make', (v) => v)),
    model: byCount([...modelCounts].map(([value, count]) => ({ value, label: value, count }))),
    chassis:
      model === undefined ? [] : byCount(list('chassis', (slug) => index.chassisLabels.get(slug)?.label ?? slug, keepChassis)),
    axle: list('axle', (a) => (a === 'front' ? 'Front axle' : 'Rear axle')),
    category: list('category', (c) => categoryLabels[c as Category]),
    wheel,
    machining: list('machining', (m) => machiningLabels[m]),
    parkingBrake: list('parkingBrake', (v) => parkingLabels[v]),
    cost: list('cost', (v) => v),
  };
}

/** Drops unknown or empty filter values, so a hand-edited URL cannot break the page. */
export function cleanFilters(f: Record<string, unknown>): SearchFilters {
  const str = (v: unknown) => (typeof v === 'string' && v.trim() ? v.trim() : undefined);
  const oneOf = <T extends string>(values: readonly T[], v: unknown) => (values.includes(v as T) ? (v as T) : undefined);
  const wheel = typeof f.wheel === 'number' ? f.wheel : typeof f.wheel === 'string' ? Number(f.wheel) : NaN;
  const out: SearchFilters = {
    make: str(f.make),
    model: str(f.model),
    chassis: str(f.chassis),
    axle: oneOf(axles, f.axle),
    category: oneOf(categories, f.category),
    wheel: Number.isFinite(wheel) && wheel > 0 && wheel < 40 ? wheel : undefined,
    machining: oneOf(machiningLevels, f.machining),
    parkingBrake: oneOf(['yes', 'no'] as const, f.parkingBrake),
    cost: oneOf(
      costBuckets.map((b) => b.value),
      f.cost,
    ),
  };
  for (const k of filterKeys) if (out[k] === undefined) delete out[k];
  return out;
}
