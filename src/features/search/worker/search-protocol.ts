import type { SearchRequest, SearchResponse } from '@shared/search/search-types';
import type { HeadChassis } from '@shared/search/shard-plan';

export type ChassisOption = HeadChassis;

export type IndexInfo = {
  /** bumps whenever the worker took in a new first index */
  version: number;
  documentCount: number;
  /** every chassis of the catalogue, with its number of approved swaps */
  chassis: ChassisOption[];
  /** the one currency all costs are in, or null when they differ */
  currency: string | null;
};

/** An answer from the part of the index loaded so far. */
export type SearchAnswer = SearchResponse & {
  /** shards the request needs that have not arrived yet; 0 when the answer is complete */
  pending: number;
};

export type ToWorker = { id: number; type: 'load' } | { id: number; type: 'query'; request: SearchRequest };
export type FromWorker =
  | { id: number; type: 'loaded'; info: IndexInfo }
  | { id: number; type: 'result'; response: SearchAnswer }
  | { id: number; type: 'error'; message: string }
  /** more shards arrived (`loaded` grows with each): answers given before may now be fuller */
  | { id: null; type: 'progress'; loaded: number };
