import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClaimResponse, ReviewQueueFilters } from '@shared/schemas/review-queue';
import { reviewQueueSearch } from '@shared/schemas/review-queue';
import type { NextResponse } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const claimRevision = (revisionId: number) => api<ClaimResponse>(`/api/review/${revisionId}/claim`, { method: 'POST' });
export const releaseClaim = (revisionId: number) => api<ClaimResponse>(`/api/review/${revisionId}/claim`, { method: 'DELETE' });

/** Claim (or extend) and release: the revision's page and the queue read fresh afterwards. */
export function useClaim(revisionId: number) {
  const queryClient = useQueryClient();
  const refresh = () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: reviewKeys.detail(revisionId) }),
      queryClient.invalidateQueries({ queryKey: reviewKeys.queues() }),
    ]);
  const claim = useMutation({ mutationFn: () => claimRevision(revisionId), onSettled: refresh });
  const release = useMutation({ mutationFn: () => releaseClaim(revisionId), onSettled: refresh });
  return { claim, release };
}

/** The oldest unclaimed submission in the filter, claimed for the moderator; `after` is the one just decided. */
export const claimNext = (filters: Partial<ReviewQueueFilters>, after?: number) => {
  const search = reviewQueueSearch({ ...filters, status: undefined });
  return api<NextResponse>(`/api/review/next${search ? `?${search}` : ''}`, { method: 'POST', body: after ? { after } : {} });
};

export function useClaimNext() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ filters, after }: { filters: Partial<ReviewQueueFilters>; after?: number }) => claimNext(filters, after),
    onSettled: () => queryClient.invalidateQueries({ queryKey: reviewKeys.queues() }),
  });
}
