import { HitsPool, type Hits } from './hits';
import { chassisFields, fields, maxEditsFor } from './search-fields';
import type { Alternative } from './query';
import { isCodeTerm, type TermIndex } from './term-index';

// Turns query words into scored documents: exact terms, prefixes while typing, the trade's other
// names for a thing, and typos (swapped letters included) as a fallback.

const PREFIX_WEIGHT = 0.375;
const FUZZY_WEIGHT = 0.45;
/** a synonym's match counts a little less than the word the reader typed */
const SYNONYM_WEIGHT = 0.9;
const allMask = (1 << fields.length) - 1;
type How = { prefix: boolean; typos: boolean };
const chassisMask = chassisFields.reduce((mask, f) => mask | (1 << fields.indexOf(f)), 0);

export class Scorer {
  private readonly pool = new HitsPool();

  constructor(private readonly index: TermIndex) {}

  take(): Hits {
    return this.pool.take(this.index.size);
  }
  give(h: Hits) {
    this.pool.give(h);
  }

  /** exact, then prefix (from two characters; two-character prefixes only on make, model and code) */
  private addWord(term: string, into: Hits, prefix: boolean) {
    const exact = this.index.id(term);
    this.index.score(exact, 1, allMask, into);
    if (!prefix || term.length < 2) return;
    const short = term.length === 2;
    const mask = short ? chassisMask : allMask;
    for (const t of this.index.withPrefix(term, short)) {
      if (t === exact) continue;
      const length = this.index.term(t).length;
      const distance = length - term.length;
      this.index.score(t, (PREFIX_WEIGHT * length) / (length + 0.3 * distance), mask, into);
    }
  }

  /**
   * Terms within the word's allowed edits, and swapped neighbours (regnet → regent) as one edit, which
   * Levenshtein distance counts as two. A typo in a code or part number keeps its first two characters:
   * the sharded index looks codes up by them.
   */
  private addFuzzy(term: string, into: Hits) {
    const maxEdits = maxEditsFor(term);
    if (!maxEdits) return;
    const found = new Map<number, number>();
    for (const [t, distance] of this.index.near(term, maxEdits)) if (distance > 0) found.set(t, distance);
    for (let i = 0; i + 1 < term.length; i++) {
      if (term[i] === term[i + 1]) continue;
      const t = this.index.id(term.slice(0, i) + term[i + 1] + term[i] + term.slice(i + 2));
      if (t >= 0) found.set(t, 1);
    }
    const code = isCodeTerm(term);
    for (const [t, distance] of found) {
      const candidate = this.index.term(t);
      if (code && !candidate.startsWith(term.slice(0, 2))) continue;
      this.index.score(t, (FUZZY_WEIGHT * candidate.length) / (candidate.length + distance), allMask, into);
    }
  }

  /**
   * One whitespace-separated chunk: its joined form, or all of its pieces (`ov-355` → `ov355…` or ov ∧ 355);
   * with `typos`, near spellings when it matches nothing as typed.
   */
  private chunk(pieces: string[], how: How): Hits {
    const joined = pieces.join('');
    const hits = this.take();
    this.addWord(joined, hits, how.prefix);
    if (pieces.length > 1) {
      const parts = pieces.map((p) => {
        const h = this.take();
        this.addWord(p, h, how.prefix);
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
    if (how.typos && hits.count === 0) this.addFuzzy(joined, hits);
    return hits;
  }

  /** documents with every chunk of one alternative */
  private alternative(alt: Alternative, how: How): Hits {
    const per = alt.chunks.map((c) => this.chunk(c, how));
    if (per.length === 1) return per[0];
    const all = this.intersect(per);
    per.forEach((h) => this.give(h));
    return all;
  }

  /**
   * One clause: the words as typed or any of their other names (tire → tyre, tyres), each alternative
   * needing all of its chunks. Typos are looked for
   * only when nothing matches as typed or by another name: fuzzy matching pulls in near-misses
   * (rotor → motor) that the reader did not ask for.
   */
  clause(alternatives: Alternative[]): Hits {
    const [typed, ...others] = alternatives;
    if (others.length === 0 && typed.chunks.length === 1) return this.chunk(typed.chunks[0], { prefix: true, typos: true });
    const hits = this.alternative(typed, { prefix: true, typos: false });
    for (const alt of others) {
      const h = this.alternative(alt, { prefix: true, typos: false });
      for (let i = 0; i < h.count; i++) hits.add(h.ids[i], SYNONYM_WEIGHT * h.score[h.ids[i]]);
      this.give(h);
    }
    if (hits.count > 0) return hits;
    this.give(hits);
    return this.alternative(typed, { prefix: true, typos: true });
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

  /**
   * Documents in any set, scores summed, with how many of the sets each is in. The largest set becomes
   * the answer (the others are added into it); the rest stay with the caller.
   */
  union(sets: Hits[]): { hits: Hits; found: Uint8Array; rest: Hits[] } {
    const largest = sets.reduce((a, b) => (a.count >= b.count ? a : b));
    const found = new Uint8Array(this.index.size);
    const { score, ids } = largest;
    for (let i = 0; i < largest.count; i++) found[ids[i]] = 1;
    const rest = sets.filter((h) => h !== largest);
    for (const h of rest) {
      for (let i = 0; i < h.count; i++) {
        const p = h.ids[i];
        if (score[p] === 0) ids[largest.count++] = p;
        score[p] += h.score[p];
        found[p]++;
      }
    }
    return { hits: largest, found, rest };
  }
}
