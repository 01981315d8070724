import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MySubmissionItem } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { submissionKeys } from './submission-keys';

export const mySubmissionsQueryOptions = () =>
  queryOptions({
    queryKey: submissionKeys.mine(),
    queryFn: () => api<{ items: MySubmissionItem[] }>('/api/me/submissions').then((r) => r.items),
    staleTime: 10_000,
  });

export const useMySubmissions = () => useQuery(mySubmissionsQueryOptions());
