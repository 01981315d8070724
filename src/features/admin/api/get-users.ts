import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { AdminUsersResponse } from '@shared/schemas/admin';
import { adminKeys } from './admin-keys';

export const getUsers = (q: string) => api<AdminUsersResponse>(`/api/admin/users?${new URLSearchParams(q ? { q } : {})}`);

export const usersQueryOptions = (q: string) =>
  queryOptions({
    queryKey: adminKeys.userList(q),
    queryFn: () => getUsers(q),
    staleTime: 10_000,
    placeholderData: keepPreviousData,
  });

export const useUsers = (q: string) => useQuery(usersQueryOptions(q));
