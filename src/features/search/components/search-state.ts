import {
  cleanFilters,
  filterKeys,
  searchSorts,
  type FilterKey,
  type SearchFilters,
  type SearchSort,
} from '@shared/search/search-types';

// The whole search lives in the address: ?q=&make=&model=&chassis=&axle=&category=&wheel=&machining=&pb=&cost=&sort=&page=

export const PAGE_SIZE = 20;

const param: Record<FilterKey, string> = {
  make: 'make',
  model: 'model',
  chassis: 'chassis',
  axle: 'axle',
  category: 'category',
  wheel: 'wheel',
  machining: 'machining',
  parkingBrake: 'pb',
  cost: 'cost',
};

export type SearchState = { q: string; filters: SearchFilters; sort: SearchSort | undefined; page: number };

export function readState(params: URLSearchParams): SearchState {
  const raw: Record<string, unknown> = {};
  for (const k of filterKeys) {
    const v = params.get(param[k]);
    if (v !== null) raw[k] = v;
  }
  const sort = params.get('sort');
  const page = Number(params.get('page'));
  return {
    q: params.get('q') ?? '',
    filters: cleanFilters(raw),
    sort: searchSorts.includes(sort as SearchSort) ? (sort as SearchSort) : undefined,
    page: Number.isInteger(page) && page > 1 ? page : 1,
  };
}

export function writeState(s: SearchState): URLSearchParams {
  const p = new URLSearchParams();
  if (s.q) p.set('q', s.q);
  for (const k of filterKeys) {
    const v = s.filters[k];
    if (v !== undefined) p.set(param[k], String(v));
  }
  if (s.sort) p.set('sort', s.sort);
  if (s.page > 1) p.set('page', String(s.page));
  return p;
}

/** Choosing a make clears the model and chassis under it; choosing a model clears the chassis. */
export function withFilter(filters: SearchFilters, key: FilterKey, value: string | number | undefined): SearchFilters {
  const next: Record<string, unknown> = { ...filters, [key]: value };
  if (key === 'make') {
    delete next.model;
    delete next.chassis;
  }
  if (key === 'model') delete next.chassis;
  return cleanFilters(next);
}
