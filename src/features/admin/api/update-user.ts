import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { AdminUserPatch, AdminUserResponse } from '@shared/schemas/admin';
import { adminKeys } from './admin-keys';

export const updateUser = ({ userId, patch }: { userId: number; patch: AdminUserPatch }) =>
  api<AdminUserResponse>(`/api/admin/users/${userId}`, { method: 'PATCH', body: patch });

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: (_data, { userId }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: adminKeys.users() }),
        queryClient.invalidateQueries({ queryKey: adminKeys.changes(userId) }),
      ]),
  });
}
