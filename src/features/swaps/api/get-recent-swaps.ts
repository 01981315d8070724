import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SwapCard } from '@shared/schemas/views';
import { swapKeys } from './swap-keys';

export const recentSwapsQueryOptions = (limit = 6) =>
  queryOptions({
    queryKey: swapKeys.recent(limit),
    queryFn: () => api<{ items: SwapCard[] }>(`/api/swaps?limit=${limit}`).then((r) => r.items),
  });

export const useRecentSwaps = (limit = 6) => useQuery(recentSwapsQueryOptions(limit));
