import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ChassisView } from '@shared/schemas/views';
import { api } from '../../../lib/api-client';

// same key and shape as the catalogue's list, so both features share one cached copy
export const chassisOptionsQueryOptions = () =>
  queryOptions({
    queryKey: ['chassis', 'list'] as const,
    queryFn: () => api<{ items: ChassisView[] }>('/api/chassis').then((r) => r.items),
    staleTime: 10 * 60_000,
  });

export const useChassisOptions = () => useQuery(chassisOptionsQueryOptions());
