import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type {
  AdminChassis,
  AdminChassisListResponse,
  AdminChassisResponse,
  AdminPart,
  AdminPartListResponse,
  AdminPartResponse,
  CatalogueChangesResponse,
  ChassisPatch,
  MergeResponse,
  PartPatch,
} from '@shared/schemas/catalogue-admin';
import { adminKeys } from './admin-keys';

const qs = (q: string) => new URLSearchParams(q ? { q } : {});

export const adminChassisQueryOptions = (q: string) =>
  queryOptions({
    queryKey: adminKeys.catalogueChassis(q),
    queryFn: () => api<AdminChassisListResponse>(`/api/admin/catalogue/chassis?${qs(q)}`).then((r) => r.chassis),
    placeholderData: keepPreviousData,
  });
export const useAdminChassis = (q: string) => useQuery(adminChassisQueryOptions(q));

export const adminPartsQueryOptions = (q: string) =>
  queryOptions({
    queryKey: adminKeys.catalogueParts(q),
    queryFn: () => api<AdminPartListResponse>(`/api/admin/catalogue/parts?${qs(q)}`).then((r) => r.parts),
    placeholderData: keepPreviousData,
  });
export const useAdminParts = (q: string) => useQuery(adminPartsQueryOptions(q));

export const catalogueChangesQueryOptions = () =>
  queryOptions({
    queryKey: adminKeys.catalogueChanges(),
    queryFn: () => api<CatalogueChangesResponse>('/api/admin/catalogue/changes').then((r) => r.changes),
  });
export const useCatalogueChanges = () => useQuery(catalogueChangesQueryOptions());

/** every catalogue change refreshes the desk's lists and record (and the public lists it feeds) */
function useCatalogueMutation<I, O>(fn: (input: I) => Promise<O>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: adminKeys.catalogue() }),
        queryClient.invalidateQueries({ queryKey: ['chassis'] }),
        queryClient.invalidateQueries({ queryKey: ['parts'] }),
      ]),
  });
}

export const useEditChassis = () =>
  useCatalogueMutation(({ id, patch }: { id: number; patch: ChassisPatch }) =>
    api<AdminChassisResponse>(`/api/admin/catalogue/chassis/${id}`, { method: 'PATCH', body: patch }),
  );
export const useApproveChassis = () =>
  useCatalogueMutation((id: number) =>
    api<AdminChassisResponse>(`/api/admin/catalogue/chassis/${id}/approve`, { method: 'POST', body: {} }),
  );
export const useMergeChassis = () =>
  useCatalogueMutation(({ id, intoId }: { id: number; intoId: number }) =>
    api<MergeResponse<AdminChassis>>(`/api/admin/catalogue/chassis/${id}/merge`, { method: 'POST', body: { intoId } }),
  );
export const useEditPart = () =>
  useCatalogueMutation(({ id, patch }: { id: number; patch: PartPatch }) =>
    api<AdminPartResponse>(`/api/admin/catalogue/parts/${id}`, { method: 'PATCH', body: patch }),
  );
export const useMergePart = () =>
  useCatalogueMutation(({ id, intoId }: { id: number; intoId: number }) =>
    api<MergeResponse<AdminPart>>(`/api/admin/catalogue/parts/${id}/merge`, { method: 'POST', body: { intoId } }),
  );
