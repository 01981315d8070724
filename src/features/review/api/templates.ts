import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ReasonTemplate } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

type Input = { label: string; text: string };

export const templatesQueryOptions = () =>
  queryOptions({
    queryKey: reviewKeys.templates(),
    queryFn: () =>
      api<{ items: ReasonTemplate[] } | ReasonTemplate[]>('/api/review/templates').then((r) => (Array.isArray(r) ? r : r.items)),
    staleTime: 5 * 60_000,
  });

export const useTemplates = () => useQuery(templatesQueryOptions());

function useTemplateMutation<V>(fn: (v: V) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => queryClient.invalidateQueries({ queryKey: reviewKeys.templates() }) });
}

export const useCreateTemplate = () =>
  useTemplateMutation((input: Input) => api<ReasonTemplate>('/api/review/templates', { method: 'POST', body: input }));
export const useUpdateTemplate = () =>
  useTemplateMutation(({ id, ...input }: Input & { id: number }) =>
    api<ReasonTemplate>(`/api/review/templates/${id}`, { method: 'PATCH', body: input }),
  );
export const useDeleteTemplate = () =>
  useTemplateMutation((id: number) => api<void>(`/api/review/templates/${id}`, { method: 'DELETE' }));
