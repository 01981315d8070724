import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreatePlan, PlanCreated, PlanList, PlanView, UpdatePlan } from '@shared/schemas/plans';
import { api } from '../../../lib/api-client';
import { deviceKeyOf, forgetDevicePlans, devicePlans, rememberDevicePlan } from './device-plans';

export const planKeys = {
  all: ['plans'] as const,
  detail: (id: string) => ['plans', 'detail', id] as const,
  mine: () => ['plans', 'mine'] as const,
};

/** The device's key for a plan it made before signing in, sent as a header (never in the address). */
const keyHeader = (id: string): Record<string, string> => {
  const key = deviceKeyOf(id);
  return key ? { 'x-plan-key': key } : {};
};

export const planQueryOptions = (id: string) =>
  queryOptions({
    queryKey: planKeys.detail(id),
    queryFn: () => api<PlanView>(`/api/plans/${id}`, { headers: keyHeader(id) }),
  });

export const usePlan = (id: string) => useQuery(planQueryOptions(id));

export const useMyPlans = (enabled: boolean) =>
  useQuery({ queryKey: planKeys.mine(), queryFn: () => api<PlanList>('/api/me/plans').then((r) => r.items), enabled });

export const useMakePlan = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreatePlan) => api<PlanCreated>('/api/plans', { method: 'POST', body: input }),
    onSuccess: (made) => {
      if (made.deviceKey) rememberDevicePlan({ id: made.id, deviceKey: made.deviceKey });
      void qc.invalidateQueries({ queryKey: planKeys.mine() });
    },
  });
};

const useChangePlan = <T>(request: (id: string, input: T) => Promise<PlanView>) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: T }) => request(id, input),
    onSuccess: (plan) => {
      qc.setQueryData(planKeys.detail(plan.id), plan);
      void qc.invalidateQueries({ queryKey: planKeys.mine() });
    },
  });
};

export const useUpdatePlan = () =>
  useChangePlan((id, input: UpdatePlan) =>
    api<PlanView>(`/api/plans/${id}`, { method: 'PATCH', body: input, headers: keyHeader(id) }),
  );

export const useRefreshPlan = () =>
  useChangePlan((id, _input: null) => api<PlanView>(`/api/plans/${id}/refresh`, { method: 'POST', headers: keyHeader(id) }));

export const useDeletePlan = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api<void>(`/api/plans/${id}`, { method: 'DELETE', headers: keyHeader(id) }),
    onSuccess: (_done, id) => {
      forgetDevicePlans([id]);
      qc.removeQueries({ queryKey: planKeys.detail(id) });
      void qc.invalidateQueries({ queryKey: planKeys.mine() });
    },
  });
};

/** Hands the plans this device made before sign-in to the signed-in member; the keys are then forgotten. */
export async function adoptDevicePlans(): Promise<string[]> {
  const plans = devicePlans();
  if (plans.length === 0) return [];
  const { adopted } = await api<{ adopted: string[] }>('/api/me/plans/adopt', { method: 'POST', body: { plans } });
  // keys the server did not accept belong to plans that were deleted or adopted elsewhere: drop them too
  forgetDevicePlans(plans.map((p) => p.id));
  return adopted;
}
