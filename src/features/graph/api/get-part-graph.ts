import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { PartGraph } from '@shared/schemas/graph';
import { graphKeys } from './graph-keys';

export const partGraphQueryOptions = (id: number) =>
  queryOptions({ queryKey: graphKeys.part(id), queryFn: () => api<PartGraph>(`/api/graph/parts/${id}`) });

export const usePartGraph = (id: number) => useQuery(partGraphQueryOptions(id));
