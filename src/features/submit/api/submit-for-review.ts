import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SubmissionView } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { submissionKeys } from './submission-keys';

/** A correction carries its "what changed and why"; a new swap sends nothing. */
export const submitForReview = ({ id, changeNote }: { id: number; changeNote?: string }) =>
  api<SubmissionView | { ok: true }>(`/api/submissions/${id}/submit`, {
    method: 'POST',
    body: changeNote === undefined ? {} : { changeNote },
  });

/** Draft or sent-back revision → in review; it is locked for its author from then on. */
export function useSubmitForReview() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: submitForReview,
    onSuccess: async (res, { id }) => {
      if (res && 'status' in res) queryClient.setQueryData(submissionKeys.detail(id), res);
      else await queryClient.invalidateQueries({ queryKey: submissionKeys.detail(id) });
      await queryClient.invalidateQueries({ queryKey: submissionKeys.mine() });
    },
  });
}
