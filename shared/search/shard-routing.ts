import SearchableMap from 'minisearch/SearchableMap';
import { normalisePartNumber, tokenize } from './normalise';
import { parseClauses, type Alternative, type Clause } from './query';
import { maxEditsFor } from './search-fields';
import { cleanFilters, searchPageSize, type SearchRequest } from './search-types';
import { addBits, bothBits, decodeShards, emptyBits, encodeShards, indicesOf, noBits, type Bits } from './shard-bits';
import { termKey, type SearchHead, type SearchTerms } from './shard-plan';
import { SortedTerms } from './sorted-terms';
import { isCodeTerm } from './term-index';

// Which shards a request needs. Conservative: every shard holding a term the scorer could reach
// (exactly, by prefix, by another name, by a typo) is named, so the loaded part of the index answers
// as the whole would.

/** terms → shard bits, with prefix and typo lookups */
class TermTable {
  readonly bits = new Map<string, Bits>();
  readonly docs = new Map<string, number>();
  private readonly sorted = new SortedTerms();
  private readonly tree = new SearchableMap<Bits>();
  private readonly list: Bits[] = [];

  constructor(entries: Record<string, string>, size: number) {
    for (const [term, text] of Object.entries(entries)) {
      const [shards, docs] = text.split(':');
      const bits = decodeShards(shards, size);
      this.bits.set(term, bits);
      this.docs.set(term, Number(docs));
      this.sorted.add(term, this.list.push(bits) - 1);
      this.tree.set(term, bits);
    }
  }

  prefixed(prefix: string, into: Bits) {
    for (const i of this.sorted.withPrefix(prefix)) addBits(into, this.list[i]);
  }

  /** within `edits` Levenshtein edits, or one swap of neighbours; for codes, keeping the first two characters */
  near(term: string, edits: number, into: Bits) {
    const keep = isCodeTerm(term) ? termKey(term) : '';
    for (const [candidate, [bits]] of this.tree.fuzzyGet(term, edits)) if (candidate.startsWith(keep)) addBits(into, bits);
    for (let i = 0; i + 1 < term.length; i++) {
      const swapped = term.slice(0, i) + term[i + 1] + term[i] + term.slice(i + 2);
      const bits = this.bits.get(swapped);
      if (bits && swapped.startsWith(keep)) addBits(into, bits);
    }
  }
}

export type Route =
  /** page one with no words or filters: the first index holds the answer */
  | { browse: true }
  | {
      browse: false;
      /** shard indices, the likeliest to hold the best results first */
      shards: number[];
      /** true when a make, model or chassis filter kept other makes' shards unloaded: their facet counts are unknown */
      restricted: boolean;
    };

type How = { prefix: boolean; typos: boolean };

export class ShardRouter {
  private readonly size: number;
  private readonly words: TermTable;
  private readonly codes = new Map<string, TermTable>();

  /** terms of the chassis fields (make, model, code) → shards: the only terms a two-character prefix reaches */
  private readonly chassisTerms: TermTable;
  /** a chassis's code, model and make as a query word would be written → the shards of the chassis so named */
  private readonly named = new Map<string, number[]>();

  constructor(readonly head: SearchHead) {
    this.size = head.shards.length;
    this.words = new TermTable(head.words, this.size);
    const holding = new Map<string, number[]>();
    for (const c of head.chassis) {
      if (c.shard === null) continue;
      for (const t of tokenize(`${c.make} ${c.model} ${c.code}`)) holding.set(t, [...(holding.get(t) ?? []), c.shard]);
      for (const name of [c.code, c.model, c.make].map(normalisePartNumber))
        this.named.set(name, [...(this.named.get(name) ?? []), c.shard]);
    }
    this.chassisTerms = new TermTable(
      Object.fromEntries([...holding].map(([t, shards]) => [t, `${encodeShards(shards, this.size)}:0`])),
      this.size,
    );
  }

  /** keys of the code tables a query needs that are not loaded yet */
  missingKeys(q: string | undefined): string[] {
    const keys = new Set<string>();
    for (const clause of parseClauses(q ?? ''))
      for (const alt of clause) for (const chunk of alt.chunks) for (const t of [chunk.join(''), ...chunk]) keys.add(termKey(t));
    return [...keys].filter((k) => !this.codes.has(k));
  }

  /** swaps in the whole collection holding `term`, if the loaded tables know it */
  docFreq(term: string): number | undefined {
    return this.words.docs.get(term) ?? this.codes.get(termKey(term))?.docs.get(term);
  }

  addTerms(t: SearchTerms) {
    if (t.generation === this.head.generation) this.codes.set(t.key, new TermTable(t.terms, this.size));
  }

  private term(term: string, how: How, into: Bits) {
    const codes = this.codes.get(termKey(term));
    const exact = this.words.bits.get(term) ?? codes?.bits.get(term);
    if (exact) addBits(into, exact);
    if (how.prefix && term.length === 2) this.chassisTerms.prefixed(term, into);
    else if (how.prefix && term.length > 2) {
      this.words.prefixed(term, into);
      codes?.prefixed(term, into);
    }
    const edits = how.typos ? maxEditsFor(term) : 0;
    if (edits) (isCodeTerm(term) ? codes : this.words)?.near(term, edits, into);
  }

  /** a chunk: its joined form, or all of its pieces; typos on the joined form only, as the scorer does */
  private chunk(pieces: string[], how: How): { bits: Bits; certain: boolean } {
    const bits = emptyBits(this.size);
    this.term(pieces.join(''), how, bits);
    if (pieces.length === 1) return { bits, certain: true };
    const each = pieces.map((p) => {
      const b = emptyBits(this.size);
      this.term(p, { prefix: how.prefix, typos: false }, b);
      return b;
    });
    addBits(bits, each.reduce(bothBits));
    return { bits, certain: false };
  }

  private alternative(alt: Alternative, how: How) {
    const per = alt.chunks.map((c) => this.chunk(c, how));
    return { bits: per.map((c) => c.bits).reduce(bothBits), certain: per.length === 1 && per[0].certain };
  }

  private clause(clause: Clause): Bits {
    const [typed, ...others] = clause;
    const first = this.alternative(typed, { prefix: true, typos: false });
    const bits = first.bits;
    for (const alt of others) addBits(bits, this.alternative(alt, { prefix: true, typos: false }).bits);
    // the scorer looks for typos when nothing matches as typed; at shard level "something might" is not certain
    if (noBits(bits) || !first.certain) addBits(bits, this.alternative(typed, { prefix: true, typos: true }).bits);
    return bits;
  }

  /** Call after `missingKeys` are loaded. */
  route(request: SearchRequest): Route {
    const f = cleanFilters(request.filters ?? {});
    const clauses = parseClauses(request.q ?? '');
    const nested = f.make !== undefined || f.model !== undefined || f.chassis !== undefined;
    const filtered = Object.keys(f).length > 0;
    const firstPage = (request.offset ?? 0) === 0 && (request.limit ?? searchPageSize) <= searchPageSize;
    if (clauses.length === 0 && !filtered && firstPage && request.sort !== 'relevance') return { browse: true };

    const all = emptyBits(this.size).fill(0xff);
    let need = all;
    if (clauses.length > 0) {
      need = emptyBits(this.size);
      for (const c of clauses) addBits(need, this.clause(c));
    }
    let restricted = false;
    if (nested) {
      const inScope = emptyBits(this.size);
      for (const c of this.head.chassis) {
        const fits =
          (f.chassis === undefined || c.slug === f.chassis) &&
          (f.make === undefined || c.make === f.make) &&
          (f.model === undefined || c.model === f.model);
        if (fits && c.shard !== null) inScope[c.shard >> 3] |= 1 << (c.shard & 7);
      }
      const narrowed = bothBits(need, inScope);
      restricted = narrowed.some((b, i) => b !== need[i]);
      need = narrowed;
    }
    const shards = indicesOf(need).filter((i) => i < this.size);
    return { browse: false, shards: this.likeliestFirst(shards, clauses), restricted };
  }

  /** shards of a chassis the query names come first (its own swaps rank highest), then the larger ones */
  private likeliestFirst(shards: number[], clauses: Clause[]): number[] {
    const named = new Set(clauses.flatMap((c) => c[0].chunks.flatMap((ch) => this.named.get(ch.join('')) ?? [])));
    const count = (i: number) => this.head.shards[i].count;
    return [...shards].sort((a, b) => Number(named.has(b)) - Number(named.has(a)) || count(b) - count(a) || a - b);
  }
}
