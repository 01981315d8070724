import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ChassisPageView, ChassisView, PartPageView } from '@shared/schemas/views';
import { swapKeys } from './swap-keys';

export const chassisListQueryOptions = () =>
  queryOptions({
    queryKey: swapKeys.chassisList(),
    queryFn: () => api<{ items: ChassisView[] }>('/api/chassis').then((r) => r.items),
    staleTime: 10 * 60_000,
  });

export const chassisQueryOptions = (slug: string) =>
  queryOptions({ queryKey: swapKeys.chassis(slug), queryFn: () => api<ChassisPageView>(`/api/chassis/${slug}`) });

export const partQueryOptions = (id: number) =>
  queryOptions({ queryKey: swapKeys.part(id), queryFn: () => api<PartPageView>(`/api/parts/${id}`) });

export const useChassisList = () => useQuery(chassisListQueryOptions());
export const useChassisPage = (slug: string) => useQuery(chassisQueryOptions(slug));
export const usePartPage = (id: number) => useQuery(partQueryOptions(id));
