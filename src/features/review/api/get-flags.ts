import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { FlagPage } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const flagsQueryOptions = (page: number) =>
  queryOptions({
    queryKey: reviewKeys.flags(page),
    queryFn: () => api<FlagPage>(`/api/review/flags?page=${page}`),
    staleTime: 15_000,
  });

export const useFlags = (page: number) => useQuery({ ...flagsQueryOptions(page), placeholderData: keepPreviousData });
