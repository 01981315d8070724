import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ReviewQueue } from '@shared/schemas/submissions';
import { reviewQueueQuerySchema, reviewQueueSearch, type ReviewQueueQuery } from '@shared/schemas/review-queue';
import { api } from '../../../lib/api-client';
import { reviewKeys, type QueueFilters } from './review-keys';

export function queueUrl(f: QueueFilters) {
  const s = reviewQueueSearch(f);
  return s ? `/api/review/queue?${s}` : '/api/review/queue';
}

/**
 * The desk's filters from the page's address, read with the schema the API uses; a value the schema refuses (an old
 * bookmark, a hand-edited address) is dropped rather than failing the page.
 */
export function queueQueryFrom(params: URLSearchParams): ReviewQueueQuery {
  const raw: Record<string, string> = Object.fromEntries(params);
  for (let tries = 0; tries < 10; tries++) {
    const parsed = reviewQueueQuerySchema.safeParse(raw);
    if (parsed.success) return parsed.data;
    for (const issue of parsed.error.issues) delete raw[String(issue.path[0])];
  }
  return reviewQueueQuerySchema.parse({});
}

export const reviewQueueQueryOptions = (f: QueueFilters) =>
  queryOptions({ queryKey: reviewKeys.queue(f), queryFn: () => api<ReviewQueue>(queueUrl(f)), staleTime: 15_000 });

export const useReviewQueue = (f: QueueFilters) => useQuery({ ...reviewQueueQueryOptions(f), placeholderData: keepPreviousData });
