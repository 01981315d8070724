import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OutboxResponse } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const outboxQueryOptions = () =>
  queryOptions({
    queryKey: reviewKeys.outbox(),
    queryFn: () =>
      api<OutboxResponse>('/api/outbox').then((r) => ({
        ...r,
        items: [...r.items].sort((a, b) => Date.parse(b.createdAt) - Date.parse(a.createdAt) || b.id - a.id),
      })),
    staleTime: 5_000,
  });

export const useOutbox = () => useQuery(outboxQueryOptions());
