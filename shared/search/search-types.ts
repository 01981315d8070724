import { axles, categories, machiningLevels, type Axle, type Category, type MachiningLevel } from '../schemas/enums';
import type { SearchDocument } from './search-document';

// What a search asks and answers: shared by the engine, the worker protocol, the page and the server's first index.

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

export function costBucketOf(minMinor: number): CostBucket {
  return costBuckets.find((b) => minMinor >= b.minMinor && minMinor < b.maxMinor)!.value;
}

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

/** results on one page of the search page (and in the first index's ready answers) */
export const searchPageSize = 20;

export type SearchRequest = { q?: string; filters?: SearchFilters; sort?: SearchSort; offset?: number; limit?: number };
export type FacetValue = { value: string; label: string; count: number };
export type SearchFacets = Record<FilterKey, FacetValue[]>;
export type SearchHit = { doc: SearchDocument; score: number | null };
export type SearchResponse = {
  /** documents in the index */
  documentCount: number;
  /** results after the query and every filter */
  total: number;
  /** words in the query as search understood them (a trade phrase such as "parking brake" counts once); 0 without a query */
  words: number;
  /** results that match every word (all of them for one word or none); they come first, the rest match some words */
  matchedAll: number;
  hits: SearchHit[];
  facets: SearchFacets;
  /** for each active filter, how many results there would be without it */
  relax: { filter: FilterKey; total: number }[];
  sort: SearchSort;
};

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
