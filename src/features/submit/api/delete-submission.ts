import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { submissionKeys } from './submission-keys';

export const deleteSubmission = (id: number) => api<void>(`/api/submissions/${id}`, { method: 'DELETE' });

/**
 * Throws a draft away (only drafts that never went to review). The deleted draft's own query is stopped, not
 * removed: the page still showing it would fetch it again at once and meet a 404. `forget` drops it once that
 * page has gone.
 */
export function useDeleteSubmission() {
  const queryClient = useQueryClient();
  const mutation = useMutation({
    mutationFn: deleteSubmission,
    onSuccess: async (_r, id) => {
      await queryClient.cancelQueries({ queryKey: submissionKeys.detail(id) });
      await queryClient.invalidateQueries({ queryKey: submissionKeys.mine() });
    },
  });
  const forget = (id: number) => queryClient.removeQueries({ queryKey: submissionKeys.detail(id), type: 'inactive' });
  return { ...mutation, forget };
}
