import { queryOptions } from '@tanstack/react-query';
import type { SearchRequest } from '@shared/search/search-types';
import type { ShardInfo } from '@shared/search/shard-plan';
import type { SearchClient } from '../worker/search-client';

export const searchKeys = {
  index: () => ['search-index'] as const,
  query: (version: number, loaded: number, request: SearchRequest) =>
    ['search-index', 'query', version, loaded, request] as const,
};

export type Fetched<T> = { status: 'unchanged' } | { status: 'fresh'; etag: string | null; body: T };
export type FetchIndexPart = <T>(path: string, etag: string | null) => Promise<Fetched<T>>;

/** A shard or code table the first index named is gone: the first index has moved on and must be read again. */
export class IndexPartGone extends Error {}

/**
 * Reads one piece of the search index, revalidating with the ETag the caller holds. Runs inside the
 * search worker, so parsing never lands on the page's main thread.
 */
export const fetchIndexPart: FetchIndexPart = async <T>(path: string, etag: string | null) => {
  const res = await fetch(path, {
    headers: { accept: 'application/json', ...(etag ? { 'if-none-match': etag } : {}) },
    credentials: 'same-origin',
    // the first index is read afresh on each visit; the parts it names sit at addresses that change with them
    cache: path === searchIndexPaths.head() ? 'no-cache' : 'default',
  });
  if (res.status === 304) return { status: 'unchanged' };
  if (res.status === 404) throw new IndexPartGone('The swap index changed while it was loading.');
  if (!res.ok) throw new Error(`The swap index could not be loaded (HTTP ${res.status}). Try again in a moment.`);
  return { status: 'fresh', etag: res.headers.get('etag'), body: (await res.json()) as T };
};

/** The first index is revalidated on each visit; shards and code tables sit at addresses that change with their content. */
export const searchIndexPaths = {
  head: () => '/api/search-index/head',
  shard: (s: Pick<ShardInfo, 'id' | 'hash'>) => `/api/search-index/shards/${encodeURIComponent(s.id)}/${s.hash}`,
  terms: (generation: string, key: string) => `/api/search-index/terms/${generation}/${encodeURIComponent(key)}`,
};

/** Loading (or revalidating) the first index in the worker; the data is what the page needs to know about it. */
export const searchIndexQueryOptions = (client: SearchClient) =>
  queryOptions({
    queryKey: searchKeys.index(),
    queryFn: () => client.load(),
    staleTime: 60_000,
    // the index lives in the reader's worker: a server render leaves the results to the browser
    meta: { browserOnly: true },
  });
