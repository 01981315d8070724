import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { UserChangesResponse } from '@shared/schemas/admin';
import { adminKeys } from './admin-keys';

export const getUserChanges = (userId: number) => api<UserChangesResponse>(`/api/admin/users/${userId}/changes`);

export const userChangesQueryOptions = (userId: number) =>
  queryOptions({ queryKey: adminKeys.changes(userId), queryFn: () => getUserChanges(userId) });

export const useUserChanges = (userId: number) => useQuery(userChangesQueryOptions(userId));
