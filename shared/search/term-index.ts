import SearchableMap from 'minisearch/SearchableMap';
import { tokenize } from './normalise';
import { SortedTerms } from './sorted-terms';
import { chassisFields, fieldBoosts, fields, fieldText } from './search-fields';
import type { SearchDocument } from './search-document';
import type { Hits } from './hits';

// The inverted index: which documents hold each term, in which field, how often. Terms go into
// minisearch's radix tree (its public SearchableMap) for typo lookups and into a sorted list for
// prefixes (a contiguous run, cheaper to walk than the tree); the postings sit
// in flat typed arrays, because walking tens of thousands of postings per keystroke through objects
// or Maps is what made every per-document search too slow at 50,000 swaps.

/** Numbers BM25 needs about the whole collection; the first index carries them so a partly loaded index scores like the whole. */
export type IndexStats = { documentCount: number; avgFieldLength: number[] };

const F = fields.length;
const BM25 = { k: 1.2, b: 0.7, d: 0.5 };
const boostById = Float64Array.from(fields, (f) => fieldBoosts[f]);
// Each contribution is rounded to a multiple of 2⁻²⁰, so sums are exact and a score does not depend
// on the order its parts were added in (one shard at a time, or all at once).
const GRID = 2 ** 20;
const STEP = 1 / GRID;
const isChassisField = fields.map((f) => chassisFields.includes(f));

const hasDigit = /\d/;
/** Terms with a digit (codes, part numbers, sizes) and plain words are looked up separately: a typo never crosses between them. */
export const isCodeTerm = (term: string) => hasDigit.test(term);

/** A document's terms field by field, in `fields` order, as the index counts them. */
export function documentTerms(doc: SearchDocument): string[][] {
  return fields.map((f) => tokenize(fieldText(doc, f)));
}

export function statsOf(docs: SearchDocument[]): IndexStats {
  const sum = new Float64Array(F);
  for (const d of docs) documentTerms(d).forEach((t, f) => (sum[f] += new Set(t).size));
  return { documentCount: docs.length, avgFieldLength: Array.from(sum, (s) => (docs.length ? s / docs.length : 0)) };
}

function grow<T extends Int32Array | Uint32Array | Uint16Array | Uint8Array | Float32Array>(a: T, need: number): T {
  if (need <= a.length) return a;
  const next = new (a.constructor as new (n: number) => T)(Math.max(need, a.length * 2));
  next.set(a);
  return next;
}

export class TermIndex {
  /**
   * `fixedStats`: the whole collection's figures, when only part of it will be loaded, so a score does
   * not depend on which shards happen to be in memory. Without them, the loaded documents count.
   */
  constructor(private readonly fixedStats: IndexStats | null = null) {}

  /** documents added so far; positions run 0 … size − 1 in the order they were added */
  size = 0;
  private readonly ids = new Map<string, number>();
  private readonly terms: string[] = [];
  private readonly words = new SearchableMap<number>();
  private readonly codes = new SearchableMap<number>();
  /** every term, and the terms of the chassis fields (make, model, code), the only ones a two-character prefix reaches */
  private readonly sorted = new SortedTerms();
  private readonly chassisTerms = new SortedTerms();
  private readonly inChassisField = new Set<number>();
  // Each add() appends one segment per (term, field) it saw; a term's segments form a list through segPrev.
  private lastSeg = new Int32Array(1024);
  private segPrev = new Int32Array(1024);
  private segField = new Uint8Array(1024);
  private segStart = new Uint32Array(1024);
  private segEnd = new Uint32Array(1024);
  private segCount = 0;
  private position = new Int32Array(4096);
  private tf = new Uint16Array(4096);
  /** each posting's BM25 term-frequency part, for the stats it was worked out with */
  private part = new Float32Array(4096);
  private partsFor: IndexStats | null = null;
  private postingCount = 0;
  /** token count of each field, by document position */
  private lengths: Uint16Array[] = Array.from({ length: F }, () => new Uint16Array(256));
  private readonly lengthSum = new Float64Array(F);
  /** per term, documents holding it in any field, as loaded */
  private docFreq = new Uint32Array(1024);
  /** the whole collection's document frequency of a term, when only part of it is loaded */
  private wholeDocFreq: ((term: string) => number | undefined) | null = null;

  add(docs: SearchDocument[]) {
    const base = this.size;
    const batch = new Map<number, { pos: number[]; tf: number[] }>();
    const lastDoc = new Map<number, number>();
    this.lengths = this.lengths.map((l) => grow(l, base + docs.length));
    docs.forEach((doc, i) => {
      const p = base + i;
      documentTerms(doc).forEach((tokens, f) => {
        const counts = new Map<string, number>();
        for (const t of tokens) counts.set(t, (counts.get(t) ?? 0) + 1);
        // a field's length is its number of distinct terms, as minisearch counts it
        this.lengths[f][p] = Math.min(counts.size, 0xffff);
        this.lengthSum[f] += counts.size;
        for (const [term, n] of counts) {
          const id = this.termId(term);
          if (isChassisField[f] && !this.inChassisField.has(id)) {
            this.inChassisField.add(id);
            this.chassisTerms.add(term, id);
          }
          if (lastDoc.get(id) !== p) {
            lastDoc.set(id, p);
            this.docFreq[id]++;
          }
          const key = id * F + f;
          let list = batch.get(key);
          if (!list) batch.set(key, (list = { pos: [], tf: [] }));
          list.pos.push(p);
          list.tf.push(Math.min(n, 0xffff));
        }
      });
    });
    this.size = base + docs.length;
    this.loaded = null;
    this.segPrev = grow(this.segPrev, this.segCount + batch.size);
    this.segField = grow(this.segField, this.segCount + batch.size);
    this.segStart = grow(this.segStart, this.segCount + batch.size);
    this.segEnd = grow(this.segEnd, this.segCount + batch.size);
    let postings = this.postingCount;
    for (const list of batch.values()) postings += list.pos.length;
    const from = this.postingCount;
    this.position = grow(this.position, postings);
    this.tf = grow(this.tf, postings);
    this.part = grow(this.part, postings);
    for (const [key, list] of batch) {
      const t = Math.floor(key / F);
      const s = this.segCount++;
      this.segPrev[s] = this.lastSeg[t];
      this.lastSeg[t] = s;
      this.segField[s] = key % F;
      this.segStart[s] = this.postingCount;
      this.position.set(list.pos, this.postingCount);
      this.tf.set(list.tf, this.postingCount);
      this.postingCount += list.pos.length;
      this.segEnd[s] = this.postingCount;
    }
    if (this.fixedStats) this.workOutParts(this.fixedStats, from);
  }

  /** k·(x·(k+1))/(x + norm) + d for postings from `from` on: the part of BM25+ that does not change per query */
  private workOutParts(stats: IndexStats, from = 0) {
    const { segField, segStart, segEnd, position, tf, part } = this;
    for (let s = 0; s < this.segCount; s++) {
      if (segEnd[s] <= from) continue;
      const f = segField[s];
      const length = this.lengths[f];
      const perLength = BM25.b / (stats.avgFieldLength[f] || 1);
      for (let i = Math.max(from, segStart[s]); i < segEnd[s]; i++) {
        const x = tf[i];
        const norm = BM25.k * (1 - BM25.b + perLength * length[position[i]]);
        part[i] = BM25.d + (x * (BM25.k + 1)) / (x + norm);
      }
    }
    this.partsFor = stats;
  }

  /** Scores then count a term's rarity over the whole collection, not over the part loaded. */
  useWholeDocFreq(lookup: (term: string) => number | undefined) {
    this.wholeDocFreq = lookup;
  }

  /** the figures scores are worked out with */
  stats(): IndexStats {
    return this.fixedStats ?? this.loadedStats();
  }

  private termId(term: string): number {
    let id = this.ids.get(term);
    if (id !== undefined) return id;
    id = this.terms.push(term) - 1;
    this.ids.set(term, id);
    (isCodeTerm(term) ? this.codes : this.words).set(term, id);
    this.sorted.add(term, id);
    this.lastSeg = grow(this.lastSeg, id + 1);
    this.lastSeg[id] = -1;
    this.docFreq = grow(this.docFreq, id + 1);
    return id;
  }

  private loaded: IndexStats | null = null;

  /** the collection as loaded so far */
  loadedStats(): IndexStats {
    return (this.loaded ??= {
      documentCount: this.size,
      avgFieldLength: Array.from(this.lengthSum, (s) => (this.size ? s / this.size : 0)),
    });
  }

  id(term: string): number {
    return this.ids.get(term) ?? -1;
  }

  term(id: number): string {
    return this.terms[id];
  }

  /** every term that starts with `prefix`, the prefix itself included; only chassis-field terms if asked */
  withPrefix(prefix: string, chassisOnly = false): number[] {
    return (chassisOnly ? this.chassisTerms : this.sorted).withPrefix(prefix);
  }

  /** terms of the same kind (word or code) within `maxEdits` Levenshtein edits, with their distance */
  near(term: string, maxEdits: number): [id: number, distance: number][] {
    const map = isCodeTerm(term) ? this.codes : this.words;
    return [...map.fuzzyGet(term, maxEdits).values()];
  }

  /** BM25+ of one term in the fields of `fieldMask`, times `weight`, added into `into` */
  score(t: number, weight: number, fieldMask: number, into: Hits) {
    if (t < 0) return;
    const stats = this.stats();
    if (this.partsFor !== stats) this.workOutParts(stats);
    const { segPrev, segField, segStart, segEnd, position, part } = this;
    const total = Math.max(stats.documentCount, this.size);
    // one document frequency per term, whichever fields hold it: the shard tables carry it for the whole collection
    const n = Math.max(this.wholeDocFreq?.(this.terms[t]) ?? 0, this.docFreq[t]);
    const idf = Math.log(1 + (total - n + 0.5) / (n + 0.5));
    const { score, ids } = into;
    let count = into.count;
    for (let s = this.lastSeg[t]; s >= 0; s = segPrev[s]) {
      const f = segField[s];
      if (!(fieldMask & (1 << f))) continue;
      const w = weight * boostById[f] * idf;
      // Hits.add by hand: this loop runs once per posting of every matched term
      for (let i = segStart[s]; i < segEnd[s]; i++) {
        const p = position[i];
        if (score[p] === 0) ids[count++] = p;
        score[p] += Math.round(w * part[i] * GRID) * STEP;
      }
    }
    into.count = count;
  }
}
