import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ChassisView } from '@shared/schemas/views';
import { api } from '../../../lib/api-client';

// the catalogue's chassis list under its usual key, for the desk's chassis filter
export const chassisFilterQueryOptions = () =>
  queryOptions({
    queryKey: ['chassis', 'list'] as const,
    queryFn: () => api<{ items: ChassisView[] }>('/api/chassis').then((r) => r.items),
    staleTime: 10 * 60_000,
  });

export const useChassisFilter = () => useQuery(chassisFilterQueryOptions());
