import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { DigestFrequency, FollowItem, FollowList } from '@shared/schemas/following';
import { api } from '../../../lib/api-client';

export const followKeys = {
  all: ['follows'] as const,
  mine: () => ['follows', 'mine'] as const,
};

export const myFollowsQueryOptions = () =>
  queryOptions({ queryKey: followKeys.mine(), queryFn: () => api<FollowList>('/api/me/follows').then((r) => r.items) });

/** The member's follows; `enabled: false` for a signed-out reader (the API would answer 401). */
export const useMyFollows = (enabled = true) => useQuery({ ...myFollowsQueryOptions(), enabled });

export type FollowTargetInput = { chassisSlug: string } | { carId: number };

export const useFollow = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: FollowTargetInput & { frequency: DigestFrequency }) =>
      api<{ follow: FollowItem }>('/api/me/follows', { method: 'POST', body: input }).then((r) => r.follow),
    onSuccess: () => qc.invalidateQueries({ queryKey: followKeys.all }),
  });
};

export const useSetFrequency = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, frequency }: { id: number; frequency: DigestFrequency }) =>
      api<{ follow: FollowItem }>(`/api/me/follows/${id}`, { method: 'PATCH', body: { frequency } }).then((r) => r.follow),
    onSuccess: () => qc.invalidateQueries({ queryKey: followKeys.all }),
  });
};

export const useStopFollow = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<void>(`/api/me/follows/${id}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: followKeys.all }),
  });
};

/** The follow of a chassis (not through a car) or of one car, if the member has it. */
export function findFollow(items: FollowItem[] | undefined, target: FollowTargetInput) {
  return (items ?? []).find((f) =>
    'carId' in target
      ? f.target.kind === 'car' && f.target.car.id === target.carId
      : f.target.kind === 'chassis' && f.target.chassis.slug === target.chassisSlug,
  );
}
