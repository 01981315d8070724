import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SwapSheetView } from '@shared/schemas/views';
import { api } from '../../../lib/api-client';

/** The current approved revision a correction starts from (same key as the sheet's query). */
export const swapToCorrectQueryOptions = (slug: string) =>
  queryOptions({ queryKey: ['swaps', 'detail', slug] as const, queryFn: () => api<SwapSheetView>(`/api/swaps/${slug}`) });

export const useSwapToCorrect = (slug: string | null) =>
  useQuery({ ...swapToCorrectQueryOptions(slug ?? ''), enabled: Boolean(slug) });
