import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SubmissionView } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { submissionKeys } from './submission-keys';

export const getSubmission = (id: number) => api<SubmissionView>(`/api/submissions/${id}`);

export const submissionQueryOptions = (id: number) =>
  queryOptions({
    queryKey: submissionKeys.detail(id),
    queryFn: () => getSubmission(id),
    // the form holds the live copy; a refetch must never overwrite what is being typed
    staleTime: Infinity,
  });

export const useSubmission = (id: number) => useQuery({ ...submissionQueryOptions(id), enabled: Number.isInteger(id) && id > 0 });
