import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TakedownInput, TakedownItem } from '@shared/schemas/takedowns';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const takeDown = (revisionId: number, input: TakedownInput) =>
  api<TakedownItem>(`/api/review/revisions/${revisionId}/takedowns`, { method: 'POST', body: input });

export const revertTakedown = (id: number) => api<TakedownItem>(`/api/review/takedowns/${id}/revert`, { method: 'POST' });

/** After a takedown or a revert, this revision's page and the public sheets read fresh. */
function useTakedownMutation<V>(revisionId: number, fn: (v: V) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: reviewKeys.detail(revisionId) }),
        queryClient.invalidateQueries({ queryKey: ['swaps'] }),
      ]),
  });
}

export const useTakeDown = (revisionId: number) =>
  useTakedownMutation(revisionId, (input: TakedownInput) => takeDown(revisionId, input));
export const useRevertTakedown = (revisionId: number) => useTakedownMutation(revisionId, revertTakedown);
