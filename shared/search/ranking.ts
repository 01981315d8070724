// Picking one page of results without sorting them all: the k best by (words matched, score, rank).

export type RankKeys = {
  /** per position, how many of the query's words it matches; null for one word or none */
  found: Uint8Array | null;
  /** per position, relevance; null to order by `rank` alone */
  score: Float64Array | null;
  /** per position, its place in the fallback order (newest or most fitted first) */
  rank: Int32Array;
};

/**
 * The k first of `ids` by higher `score` (if any), then lower `rank`, appended to `out`. Written out
 * without callbacks and with the page's last entry in locals: it runs over every match of a broad
 * word on each keystroke, and nearly every candidate is turned away at the first comparison.
 */
function topK(ids: Int32Array, k: number, score: Float64Array | null, rank: Int32Array, out: number[]) {
  const top: number[] = [];
  let lastScore = -Infinity;
  let lastRank = 0;
  for (let i = 0; i < ids.length && k > 0; i++) {
    const p = ids[i];
    const s = score === null ? 0 : score[p];
    const r = rank[p];
    if (top.length === k && (s < lastScore || (s === lastScore && r > lastRank))) continue;
    let j = top.length < k ? top.length : k - 1;
    while (j > 0) {
      const q = top[j - 1];
      const qs = score === null ? 0 : score[q];
      if (s < qs || (s === qs && r > rank[q])) break;
      top[j] = q;
      j--;
    }
    top[j] = p;
    if (top.length === k) {
      lastScore = score === null ? 0 : score[top[k - 1]];
      lastRank = rank[top[k - 1]];
    }
  }
  for (const p of top) out.push(p);
}

/**
 * The first `k` results, and how many match all `words`. Swaps matching more words come first; within
 * the same number of words, by score or rank. Tiers the page does not reach are never ranked: a broad
 * word must not make every keystroke rank thousands of swaps that will not be shown.
 */
export function rankPage(passing: Int32Array, k: number, words: number, { found, score, rank }: RankKeys) {
  const page: number[] = [];
  if (found === null) {
    topK(passing, k, score, rank, page);
    return { page, matchedAll: passing.length };
  }
  const perTier = new Int32Array(words + 1);
  for (let i = 0; i < passing.length; i++) perTier[found[passing[i]]]++;
  for (let tier = words; tier >= 1 && page.length < k; tier--) {
    if (perTier[tier] === 0) continue;
    const inTier = perTier[tier] === passing.length ? passing : new Int32Array(perTier[tier]);
    if (inTier !== passing) {
      let n = 0;
      for (let i = 0; i < passing.length; i++) if (found[passing[i]] === tier) inTier[n++] = passing[i];
    }
    topK(inTier, k - page.length, score, rank, page);
  }
  return { page, matchedAll: perTier[words] };
}
