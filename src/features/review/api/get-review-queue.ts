import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ReviewQueue } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { reviewKeys, type QueueFilters } from './review-keys';

export function queueUrl(f: QueueFilters) {
  const q = new URLSearchParams();
  if (f.status) q.set('status', f.status);
  if (f.chassis) q.set('chassis', f.chassis);
  if (f.olderThanDays) q.set('olderThanDays', String(f.olderThanDays));
  const s = q.toString();
  return s ? `/api/review/queue?${s}` : '/api/review/queue';
}

export const reviewQueueQueryOptions = (f: QueueFilters) =>
  queryOptions({ queryKey: reviewKeys.queue(f), queryFn: () => api<ReviewQueue>(queueUrl(f)), staleTime: 15_000 });

export const useReviewQueue = (f: QueueFilters) => useQuery({ ...reviewQueueQueryOptions(f), placeholderData: keepPreviousData });
