import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SubmissionView } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { submissionKeys } from './submission-keys';

export const withdrawSubmission = (id: number) => api<SubmissionView>(`/api/submissions/${id}/withdraw`, { method: 'POST' });

/** The author takes a submission off the review desk; it is a draft again. */
export function useWithdrawSubmission() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: withdrawSubmission,
    onSuccess: async (view, id) => {
      queryClient.setQueryData(submissionKeys.detail(id), view);
      await queryClient.invalidateQueries({ queryKey: submissionKeys.all });
    },
  });
}
