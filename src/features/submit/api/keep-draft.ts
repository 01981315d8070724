import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SubmissionView } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { submissionKeys } from './submission-keys';

export const keepDraft = (id: number) => api<SubmissionView>(`/api/submissions/${id}/keep`, { method: 'POST' });

/** The author keeps a draft they were told would be removed. */
export function useKeepDraft() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: keepDraft,
    onSuccess: (view, id) => queryClient.setQueryData(submissionKeys.detail(id), view),
  });
}
