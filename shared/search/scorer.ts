import { HitsPool, type Hits } from './hits';
import { chassisFields, fields, maxEditsFor } from './search-fields';
import type { IndexStats, TermIndex } from './term-index';

// Turns query words into scored documents: exact terms, prefixes while typing, typos as a fallback.

const PREFIX_WEIGHT = 0.375;
const FUZZY_WEIGHT = 0.45;
const allMask = (1 << fields.length) - 1;
const chassisMask = chassisFields.reduce((mask, f) => mask | (1 << fields.indexOf(f)), 0);

export class Scorer {
  private readonly pool = new HitsPool();

  constructor(
    private readonly index: TermIndex,
    private readonly stats: () => IndexStats,
  ) {}

  take(): Hits {
    return this.pool.take(this.index.size);
  }
  give(h: Hits) {
    this.pool.give(h);
  }

  /** exact, then prefix (from two characters; two-character prefixes only on make, model and code) */
  private addWord(term: string, into: Hits) {
    const stats = this.stats();
    const exact = this.index.id(term);
    this.index.score(exact, 1, allMask, into, stats);
    if (term.length < 2) return;
    const mask = term.length === 2 ? chassisMask : allMask;
    for (const t of this.index.withPrefix(term)) {
      if (t === exact) continue;
      const length = this.index.term(t).length;
      const distance = length - term.length;
      this.index.score(t, (PREFIX_WEIGHT * length) / (length + 0.3 * distance), mask, into, stats);
    }
  }

  private addFuzzy(term: string, into: Hits) {
    const maxEdits = maxEditsFor(term);
    if (!maxEdits) return;
    const stats = this.stats();
    for (const [t, distance] of this.index.near(term, maxEdits)) {
      if (distance === 0) continue;
      const length = this.index.term(t).length;
      this.index.score(t, (FUZZY_WEIGHT * length) / (length + distance), allMask, into, stats);
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
