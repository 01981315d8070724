import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const resolveFlag = ({ id, note }: { id: number; note: string }) =>
  api<unknown>(`/api/review/flags/${id}/resolve`, { method: 'POST', body: { note } });

export function useResolveFlag() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resolveFlag,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.queues() }),
  });
}
