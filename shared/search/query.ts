import { parseQuery } from './normalise';
import { tradeSynonyms } from './synonyms';

// A query as clauses: each clause is one thing the reader asked for, a word or a trade phrase with
// its other names. A swap matches a clause when it matches any of the clause's alternatives, and an
// alternative when it matches all of its chunks.

export type Alternative = {
  /** whitespace-separated chunks, each as its pieces (`ov-355` → ov, 355) */
  chunks: string[][];
  /** the words the reader typed, as opposed to a synonym of them */
  typed: boolean;
};
export type Clause = Alternative[];

type Phrase = { words: string[]; chunks: string[][]; group: number };

/** every synonym phrase by its first word, longest first */
const phrasesByFirstWord = (() => {
  const byFirst = new Map<string, Phrase[]>();
  tradeSynonyms.forEach((group, g) => {
    for (const text of group) {
      const chunks = parseQuery(text);
      const phrase = { words: chunks.map((c) => c.join('')), chunks, group: g };
      const list = byFirst.get(phrase.words[0]) ?? [];
      list.push(phrase);
      byFirst.set(phrase.words[0], list);
    }
  });
  for (const list of byFirst.values()) list.sort((a, b) => b.words.length - a.words.length);
  return byFirst;
})();

const wordsOf = (chunks: string[][]) => chunks.map((c) => c.join(''));

/**
 * The group's other phrases, without those that add nothing to what is already asked: a phrase that
 * holds every word of a shorter one ("brake rotor" beside "rotor") finds only swaps the shorter one finds.
 */
function otherNames(typed: Phrase): string[][][] {
  const group = tradeSynonyms[typed.group].map((text) => parseQuery(text));
  const covers = (a: string[][], b: string[][]) => a !== b && wordsOf(b).every((w) => wordsOf(a).includes(w));
  return group.filter(
    (alt) => wordsOf(alt).join(' ') !== typed.words.join(' ') && !group.some((shorter) => covers(alt, shorter)),
  );
}

/** Splits a query into clauses, recognising trade phrases (longest first). Empty for a query too short to search. */
export function parseClauses(q: string): Clause[] {
  const chunks = parseQuery(q);
  if (chunks.reduce((n, c) => n + c.join('').length, 0) < 2) return [];
  const words = chunks.map((c) => c.join(''));
  const clauses: Clause[] = [];
  for (let i = 0; i < chunks.length;) {
    const phrase = phrasesByFirstWord.get(words[i])?.find((p) => p.words.every((w, k) => words[i + k] === w));
    if (!phrase) {
      clauses.push([{ chunks: [chunks[i]], typed: true }]);
      i++;
      continue;
    }
    const typed = chunks.slice(i, i + phrase.words.length);
    clauses.push([{ chunks: typed, typed: true }, ...otherNames(phrase).map((alt) => ({ chunks: alt, typed: false }))]);
    i += phrase.words.length;
  }
  return clauses;
}
