import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const bulkDecline = (input: { revisionIds: number[]; note: string }) =>
  api<{ declined?: number[] } | undefined>('/api/review/bulk-decline', { method: 'POST', body: input });

export function useBulkDecline() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: bulkDecline,
    onSuccess: async (_r, input) => {
      await queryClient.invalidateQueries({ queryKey: reviewKeys.queues() });
      for (const id of input.revisionIds) queryClient.removeQueries({ queryKey: reviewKeys.detail(id) });
    },
  });
}
