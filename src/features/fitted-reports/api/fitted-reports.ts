import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { FittedReportsView, ModerationReportList } from '@shared/schemas/fitted-reports';
import { api } from '../../../lib/api-client';

export const fittedKeys = {
  all: ['fitted-reports'] as const,
  forSwap: (slug: string) => ['fitted-reports', slug] as const,
};

export const fittedReportsQueryOptions = (slug: string) =>
  queryOptions({
    queryKey: fittedKeys.forSwap(slug),
    queryFn: () => api<FittedReportsView>(`/api/swaps/${slug}/fitted-reports`),
  });

export const useFittedReports = (slug: string) => useQuery(fittedReportsQueryOptions(slug));

/** Fields as the form has them; sent as multipart when a photo comes along, JSON otherwise. */
export type ReportFields = {
  revisionNumber: number;
  diameterIn: string;
  widthIn: string;
  offsetMm: string;
  spacerMm: number;
  clearanceMm: number | null;
  note: string;
  removePhoto?: boolean;
};

function payload(fields: ReportFields, photo: File | null) {
  if (!photo) return fields;
  const form = new FormData();
  // an empty field is how a form says "not measured"
  for (const [k, v] of Object.entries(fields)) if (v !== undefined) form.append(k, v === null ? '' : String(v));
  form.append('photo', photo);
  return form;
}

/** `onChanged` lets the page refresh whatever else shows the count (the sheet's own query). */
export const useSaveFittedReport = (slug: string, exists: boolean, onChanged?: () => void) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ fields, photo }: { fields: ReportFields; photo: File | null }) =>
      api<FittedReportsView>(exists ? `/api/swaps/${slug}/fitted-reports/mine` : `/api/swaps/${slug}/fitted-reports`, {
        method: exists ? 'PATCH' : 'POST',
        body: payload(fields, photo),
      }),
    onSuccess: (view) => {
      qc.setQueryData(fittedKeys.forSwap(slug), view);
      onChanged?.();
    },
  });
};

export const useDeleteFittedReport = (slug: string, onChanged?: () => void) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>(`/api/swaps/${slug}/fitted-reports/mine`, { method: 'DELETE' }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: fittedKeys.forSwap(slug) });
      onChanged?.();
    },
  });
};

export const useHideFittedReport = (slug: string, onChanged?: () => void) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, hidden }: { id: number; hidden: boolean }) =>
      api<{ id: number; hidden: boolean }>(`/api/fitted-reports/${id}/${hidden ? 'hide' : 'unhide'}`, { method: 'POST' }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: fittedKeys.forSwap(slug) });
      void qc.invalidateQueries({ queryKey: moderationKeys.all });
      onChanged?.();
    },
  });
};

export const moderationKeys = {
  all: ['fitted-reports', 'moderation'] as const,
  list: (show: 'held' | 'hidden') => ['fitted-reports', 'moderation', show] as const,
};

export const moderationReportsQueryOptions = (show: 'held' | 'hidden') =>
  queryOptions({
    queryKey: moderationKeys.list(show),
    queryFn: () => api<ModerationReportList>(`/api/fitted-reports?show=${show}`),
  });

export const useModerationReports = (show: 'held' | 'hidden') => useQuery(moderationReportsQueryOptions(show));

/** A moderator lets a held report go live; the sheet's list and the moderators' lists are read again. */
export const useReleaseFittedReport = (slug: string, onChanged?: () => void) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<{ id: number; state: 'live' }>(`/api/fitted-reports/${id}/release`, { method: 'POST' }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: fittedKeys.forSwap(slug) });
      void qc.invalidateQueries({ queryKey: moderationKeys.all });
      onChanged?.();
    },
  });
};
