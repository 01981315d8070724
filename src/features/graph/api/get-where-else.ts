import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { WhereElse } from '@shared/schemas/graph';
import { graphKeys } from './graph-keys';

export const whereElseQueryOptions = (number: string) =>
  queryOptions({
    queryKey: graphKeys.whereElse(number),
    queryFn: () => api<WhereElse>(`/api/graph/where-else?number=${encodeURIComponent(number)}`),
  });

/** nothing is asked until a number is typed */
export const useWhereElse = (number: string) =>
  useQuery({ ...whereElseQueryOptions(number), enabled: number.trim().length > 0, placeholderData: keepPreviousData });
