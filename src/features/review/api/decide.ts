import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, ApiError } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export type Decision = 'approve' | 'send-back' | 'decline';

export const decide = (revisionId: number, decision: Decision, note: string) =>
  api<unknown>(`/api/review/${revisionId}/${decision}`, { method: 'POST', body: { note } });

/** One decision on one revision; the queue and this revision's page read fresh afterwards. */
export function useDecide(revisionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ decision, note }: { decision: Decision; note: string }) => decide(revisionId, decision, note),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: reviewKeys.detail(revisionId) }),
        queryClient.invalidateQueries({ queryKey: reviewKeys.queues() }),
        // the public sheet and search change on approval
        queryClient.invalidateQueries({ queryKey: ['swaps'] }),
        queryClient.invalidateQueries({ queryKey: ['search-index'] }),
      ]);
    },
    onError: async (err) => {
      // another correction was approved meanwhile: the page shows what it changed
      if (err instanceof ApiError && err.code === 'behind_current')
        await queryClient.invalidateQueries({ queryKey: reviewKeys.detail(revisionId) });
    },
  });
}
