import { queryOptions } from '@tanstack/react-query';
import type { SearchIndexResponse } from '@shared/search/search-document';
import type { SearchRequest } from '@shared/search/search-types';
import type { SearchClient } from '../worker/search-client';

export const searchKeys = {
  index: () => ['search-index'] as const,
  query: (version: number, request: SearchRequest) => ['search-index', 'query', version, request] as const,
};

export type SearchIndexFetch =
  { status: 'unchanged' } | { status: 'fresh'; etag: string | null; documents: SearchIndexResponse['documents'] };

/**
 * Reads the index, revalidating with the ETag the caller holds. Runs inside the search worker, so the
 * multi-megabyte parse never lands on the page's main thread.
 */
export async function getSearchIndex(etag: string | null, signal?: AbortSignal): Promise<SearchIndexFetch> {
  const res = await fetch('/api/search-index', {
    headers: { accept: 'application/json', ...(etag ? { 'if-none-match': etag } : {}) },
    credentials: 'same-origin',
    signal,
  });
  if (res.status === 304) return { status: 'unchanged' };
  if (!res.ok) throw new Error(`The swap index could not be loaded (HTTP ${res.status}). Try again in a moment.`);
  const body = (await res.json()) as SearchIndexResponse;
  return { status: 'fresh', etag: res.headers.get('etag'), documents: body.documents };
}

/** Loading (or revalidating) the index in the worker; the data is what the page needs to know about it. */
export const searchIndexQueryOptions = (client: SearchClient) =>
  queryOptions({
    queryKey: searchKeys.index(),
    queryFn: () => client.load(),
    staleTime: 60_000,
  });
