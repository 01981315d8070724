import { useEffect, useState } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { SearchRequest } from '@shared/search/search-types';
import { searchIndexQueryOptions, searchKeys } from '../api/get-search-index';
import { searchClient } from '../worker/search-client';

export const useSearchIndex = () => useQuery(searchIndexQueryOptions(searchClient));

/**
 * Answers from the worker for one search state; the previous answer stays up while the next is
 * computed, and an answer given before all its shards arrived is asked again as they do.
 */
export function useSearch(request: SearchRequest) {
  const index = useSearchIndex();
  const version = index.data?.version ?? 0;
  const [loaded, setLoaded] = useState(0);
  useEffect(() => searchClient.onProgress(setLoaded), []);
  const results = useQuery({
    queryKey: searchKeys.query(version, loaded, request),
    queryFn: () => searchClient.query(request),
    enabled: version > 0,
    meta: { browserOnly: true },
    placeholderData: keepPreviousData,
    staleTime: Infinity,
    gcTime: 60_000,
  });
  return { index, results };
}
