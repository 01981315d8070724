import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PartMatchResponse, PartSearchResponse } from '@shared/schemas/catalogue';
import { api } from '../../../lib/api-client';

export const cataloguePartKeys = {
  search: (q: string) => ['parts', 'search', q] as const,
  match: (maker: string, numbers: string) => ['parts', 'match', maker, numbers] as const,
};

export const partSearchQueryOptions = (q: string) =>
  queryOptions({
    queryKey: cataloguePartKeys.search(q),
    queryFn: () => api<PartSearchResponse>(`/api/parts?${new URLSearchParams({ q })}`).then((r) => r.items),
    enabled: q.trim() !== '',
    staleTime: 60_000,
    placeholderData: keepPreviousData,
  });

export const usePartSearch = (q: string) => useQuery(partSearchQueryOptions(q));

/** the catalogue part a part being proposed already is, by maker and number (the server's rule) */
export const partMatchQueryOptions = (maker: string, numbers: string) =>
  queryOptions({
    queryKey: cataloguePartKeys.match(maker, numbers),
    queryFn: () => api<PartMatchResponse>(`/api/parts/match?${new URLSearchParams({ maker, numbers })}`).then((r) => r.match),
    enabled: maker.trim() !== '' && numbers.replace(/[\s,]/g, '') !== '',
    staleTime: 60_000,
  });

export const usePartMatch = (maker: string, numbers: string) => useQuery(partMatchQueryOptions(maker, numbers));
