import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { RebasePreview, RebaseSubmission, SubmissionView } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { submissionKeys } from './submission-keys';

const rebaseKey = (id: number) => [...submissionKeys.detail(id), 'rebase'] as const;

/** The three-way merge of a correction with the revision approved since it started. */
export const useRebasePreview = (id: number) =>
  useQuery({
    queryKey: rebaseKey(id),
    queryFn: () => api<RebasePreview>(`/api/submissions/${id}/rebase`),
    enabled: Number.isInteger(id) && id > 0,
    retry: false,
  });

/** Applies the merge with the author's picks; the correction then starts from the current revision. */
export function useRebaseSubmission(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: RebaseSubmission) =>
      api<SubmissionView>(`/api/submissions/${id}/rebase`, { method: 'POST', body: input }),
    onSuccess: async (view) => {
      queryClient.setQueryData(submissionKeys.detail(id), view);
      queryClient.removeQueries({ queryKey: rebaseKey(id) });
      await queryClient.invalidateQueries({ queryKey: submissionKeys.mine() });
    },
  });
}
