import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { SwapSheetView } from '@shared/schemas/views';
import { swapKeys } from './swap-keys';

export const getSwap = (slug: string, n?: number) =>
  api<SwapSheetView>(n === undefined ? `/api/swaps/${slug}` : `/api/swaps/${slug}/revisions/${n}`);

export const swapQueryOptions = (slug: string, n?: number) =>
  queryOptions({
    queryKey: n === undefined ? swapKeys.detail(slug) : swapKeys.revision(slug, n),
    queryFn: () => getSwap(slug, n),
  });

export const useSwap = (slug: string, n?: number) => useQuery(swapQueryOptions(slug, n));
