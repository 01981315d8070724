import type { SearchRequest, SearchResponse } from '@shared/search/search-types';
import type { SearchDocument } from '@shared/search/search-document';

export type ChassisOption = SearchDocument['chassis'];

export type IndexInfo = {
  /** bumps whenever the worker rebuilt its index */
  version: number;
  documentCount: number;
  buildMs: number;
  /** every chassis that has at least one approved swap */
  chassis: ChassisOption[];
  /** the one currency all costs are in, or null when they differ */
  currency: string | null;
};

export type ToWorker = { id: number; type: 'load' } | { id: number; type: 'query'; request: SearchRequest };
export type FromWorker =
  | { id: number; type: 'loaded'; info: IndexInfo }
  | { id: number; type: 'result'; response: SearchResponse }
  | { id: number; type: 'error'; message: string };
