import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BulkResolveResponse } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const resolveFlag = ({ id, note }: { id: number; note: string }) =>
  api<unknown>(`/api/review/flags/${id}/resolve`, { method: 'POST', body: { note } });

export const bulkResolveFlags = ({ ids, note }: { ids: number[]; note: string }) =>
  api<BulkResolveResponse>('/api/review/flags/bulk-resolve', { method: 'POST', body: { ids, note } });

/** The queue's counts and every page of flags read fresh after a resolve. */
function useFlagMutation<V>(fn: (v: V) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: reviewKeys.queues() }),
        queryClient.invalidateQueries({ queryKey: reviewKeys.allFlags() }),
      ]),
  });
}

export const useResolveFlag = () => useFlagMutation(resolveFlag);
export const useBulkResolveFlags = () => useFlagMutation(bulkResolveFlags);
