import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ChassisGraph } from '@shared/schemas/graph';
import { graphKeys } from './graph-keys';

export const chassisGraphQueryOptions = (slug: string) =>
  queryOptions({
    queryKey: graphKeys.chassis(slug),
    queryFn: () => api<ChassisGraph>(`/api/graph/chassis/${encodeURIComponent(slug)}`),
  });

export const useChassisGraph = (slug: string) => useQuery(chassisGraphQueryOptions(slug));
