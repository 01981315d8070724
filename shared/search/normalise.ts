// Text normalisation shared by indexing and querying, so both sides agree on what a term is.

const separators = /[^\p{L}\p{N}]+/u;

/** Lower-case and strip accents: "Orsíno" → "orsino". */
export function foldTerm(term: string): string {
  return term
    .normalize('NFKD')
    .replace(/\p{M}+/gu, '')
    .toLowerCase();
}

/** Part numbers compare without case or separators: `OV-355-104-L` → `ov355104l`. */
export function normalisePartNumber(value: string): string {
  return foldTerm(value).split(separators).join('');
}

/** The words of one whitespace-free chunk: `OV-355-104-L` → ov, 355, 104, l. */
export function chunkPieces(chunk: string): string[] {
  return foldTerm(chunk)
    .split(separators)
    .filter((p) => p.length > 0);
}

/** Whitespace (and list punctuation) separates chunks; hyphens, dots and slashes inside a chunk do not. */
export function splitChunks(text: string): string[] {
  return text.split(/[\s,;|()[\]{}"'“”‘’]+/u).filter((c) => c.length > 0);
}

/**
 * Index-side tokenizer: every word, plus the joined form of any chunk that had separators inside,
 * so `OV-355-104-L` is findable as `ov`, `355`, `ov355104l` and, by prefix, `ov355`.
 */
export function tokenize(text: string): string[] {
  const out: string[] = [];
  for (const chunk of splitChunks(text)) {
    const pieces = chunkPieces(chunk);
    out.push(...pieces);
    if (pieces.length > 1) out.push(pieces.join(''));
  }
  return out;
}

/** Terms arrive already folded by `tokenize`; this only drops empties. */
export function processTerm(term: string): string | null {
  const t = foldTerm(term);
  return t.length > 0 ? t : null;
}

/** A query as chunks, each chunk as its pieces (one piece for a plain word). */
export function parseQuery(query: string): string[][] {
  return splitChunks(query)
    .map(chunkPieces)
    .filter((pieces) => pieces.length > 0);
}

// groups of capitals and digits joined by dashes, dots or slashes: OV-355-101-R, H40.615.057/L
const partNumberLike = /(?<![\p{L}\p{N}])[A-Z0-9]+(?:[-./][A-Z0-9]+)+(?![\p{L}\p{N}])/gu;

/**
 * Part numbers written into free text ("early calipers carry the stamp OV-355-101-R"): capitals and
 * digits in two or more groups, with at least one of each. Sizes (2.0, 15-inch), threads (M12×1.5)
 * and plain codes (H31, ET35) are not picked up.
 */
export function partNumbersIn(text: string): string[] {
  const found = text.match(partNumberLike) ?? [];
  return [...new Set(found.filter((m) => /\d/.test(m) && /[A-Z]/.test(m) && m.length >= 5))];
}
