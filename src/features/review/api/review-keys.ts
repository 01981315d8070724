import type { ReviewQueueQuery } from '@shared/schemas/review-queue';

export type QueueFilters = Partial<ReviewQueueQuery>;

export const reviewKeys = {
  all: ['review'] as const,
  queues: () => ['review', 'queue'] as const,
  queue: (f: QueueFilters) => ['review', 'queue', f] as const,
  detail: (revisionId: number) => ['review', 'detail', revisionId] as const,
  allFlags: () => ['review', 'flags'] as const,
  flags: (page: number) => ['review', 'flags', page] as const,
  templates: () => ['review', 'templates'] as const,
  outbox: () => ['outbox'] as const,
};
