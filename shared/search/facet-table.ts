import type { Hits } from './hits';
import { filterKeys, type FilterKey } from './search-types';

// Counting facet values over a set of documents, in typed arrays. Every facet value is a small
// integer per document (0 = not given), shifted into one code space shared by all groups.

export const groups = filterKeys;
export type Group = FilterKey;
export const G = groups.length;
/** the groups a chassis decides (make, model) and the rest, which are combined per document for counting */
const chassisIndex = groups.indexOf('chassis');
const byChassis = [groups.indexOf('make'), groups.indexOf('model')];
const rest = groups.map((_, i) => i).filter((i) => i !== chassisIndex && !byChassis.includes(i));

export type FacetTable = {
  /** group g owns shared codes offset[g] … offset[g + 1] − 1 */
  offset: Int32Array;
  /** document p, group g at p·G + g: counting a document under filters is nine adjacent `counts[code]++` */
  codes: Uint16Array | Uint32Array;
  /** counts over every document, for browsing without a query or filter */
  all: Int32Array;
  /**
   * Without filters a document counts as two codes: its chassis (which decides make and model) and the
   * combination of its other values, numbered as they occur; the totals are spread back afterwards.
   */
  pair: Uint32Array;
  chassisCodes: Int32Array;
  comboCodes: Int32Array;
  chassisCount: number;
};

/** Lays out the codes of `size` documents, given each group's code by document. */
export function layoutTable(byDoc: Record<Group, Uint32Array>, valueCounts: Record<Group, number>, size: number): FacetTable {
  const offset = new Int32Array(G + 1);
  groups.forEach((g, i) => (offset[i + 1] = offset[i] + valueCounts[g]));
  const codes = offset[G] <= 0xffff ? new Uint16Array(size * G) : new Uint32Array(size * G);
  groups.forEach((g, i) => {
    const own = byDoc[g];
    for (let p = 0; p < size; p++) codes[p * G + i] = offset[i] + own[p];
  });
  const all = new Int32Array(offset[G]);
  for (let j = 0; j < codes.length; j++) all[codes[j]]++;

  const chassisCount = valueCounts.chassis;
  const chassisCodes = new Int32Array(chassisCount * byChassis.length);
  const combos = new Map<string, number>();
  const comboList: number[] = [];
  const pair = new Uint32Array(size * 2);
  for (let p = 0; p < size; p++) {
    const base = p * G;
    const c = codes[base + chassisIndex] - offset[chassisIndex];
    byChassis.forEach((g, k) => (chassisCodes[c * byChassis.length + k] = codes[base + g]));
    const key = rest.map((g) => codes[base + g]).join(',');
    let combo = combos.get(key);
    if (combo === undefined) {
      combo = combos.size;
      combos.set(key, combo);
      for (const g of rest) comboList.push(codes[base + g]);
    }
    pair[p * 2] = c;
    pair[p * 2 + 1] = combo;
  }
  return { offset, codes, all, pair, chassisCodes, comboCodes: Int32Array.from(comboList), chassisCount };
}

/** Turns counts by chassis and by combination back into counts by shared code. */
function spread(table: FacetTable, perChassis: Int32Array, perCombo: Int32Array): Int32Array {
  const { offset, chassisCodes, comboCodes } = table;
  const counts = new Int32Array(offset[G]);
  const k = byChassis.length;
  for (let c = 0; c < perChassis.length; c++) {
    const n = perChassis[c];
    if (n === 0) continue;
    counts[offset[chassisIndex] + c] += n;
    for (let j = 0; j < k; j++) counts[chassisCodes[c * k + j]] += n;
  }
  const r = rest.length;
  for (let combo = 0; combo < perCombo.length; combo++) {
    const n = perCombo[combo];
    if (n === 0) continue;
    for (let j = 0; j < r; j++) counts[comboCodes[combo * r + j]] += n;
  }
  return counts;
}

export type RawTally = { passing: Int32Array; flatCounts: Int32Array; relaxCounts: Int32Array };

/**
 * No filter: every candidate passes and counts in every group. When the match covers most of the
 * index it is cheaper to count the documents it misses and take them away from the totals.
 */
export function tallyUnfiltered(table: FacetTable, candidates: Int32Array, hits: Hits | null): RawTally {
  const relaxCounts = new Int32Array(G);
  if (hits === null) return { passing: candidates, flatCounts: table.all, relaxCounts };
  const { pair } = table;
  const size = pair.length / 2;
  const perChassis = new Int32Array(table.chassisCount);
  const perCombo = new Int32Array(table.comboCodes.length / rest.length);
  if (hits.count * 2 > size) {
    const score = hits.score;
    for (let p = 0; p < size; p++) {
      if (score[p] !== 0) continue;
      perChassis[pair[p * 2]]++;
      perCombo[pair[p * 2 + 1]]++;
    }
    const missed = spread(table, perChassis, perCombo);
    for (let j = 0; j < missed.length; j++) missed[j] = table.all[j] - missed[j];
    return { passing: candidates, flatCounts: missed, relaxCounts };
  }
  for (let i = 0; i < candidates.length; i++) {
    const p = candidates[i];
    perChassis[pair[p * 2]]++;
    perCombo[pair[p * 2 + 1]]++;
  }
  return { passing: candidates, flatCounts: spread(table, perChassis, perCombo), relaxCounts };
}

/**
 * With filters: a candidate passes when no group rejects it; it counts in a group's facet when only
 * that group's own (or its nested) filters reject it; one rejecting filter means it would pass without it.
 */
export function tallyFiltered(
  table: FacetTable,
  candidates: Int32Array,
  allowed: Record<Group, Uint8Array | null>,
  ignoredBy: Record<Group, number>,
): RawTally {
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
