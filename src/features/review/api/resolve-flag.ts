import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BulkResolveResponse, FlagItem } from '@shared/schemas/submissions';
import type { FlagOutcome } from '@shared/schemas/flags';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

type Resolution = { outcome: FlagOutcome; note: string; correctionRevisionId?: number | null };

export const resolveFlag = ({ id, ...body }: Resolution & { id: number }) =>
  api<FlagItem>(`/api/review/flags/${id}/resolve`, { method: 'POST', body });

export const bulkResolveFlags = (body: Resolution & { ids: number[] }) =>
  api<BulkResolveResponse>('/api/review/flags/bulk-resolve', { method: 'POST', body });

export const linkFlag = ({ id, revisionId }: { id: number; revisionId: number | null }) =>
  api<FlagItem>(`/api/review/flags/${id}/link`, { method: 'POST', body: { revisionId } });

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
export const useLinkFlag = () => useFlagMutation(linkFlag);
