import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { submissionKeys } from './submission-keys';

export const deleteSubmission = (id: number) => api<void>(`/api/submissions/${id}`, { method: 'DELETE' });

/** Throws a draft away (only drafts that never went to review). */
export function useDeleteSubmission() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSubmission,
    onSuccess: async (_r, id) => {
      queryClient.removeQueries({ queryKey: submissionKeys.detail(id) });
      await queryClient.invalidateQueries({ queryKey: submissionKeys.mine() });
    },
  });
}
