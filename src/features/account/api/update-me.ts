import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { MeResponse, MeUser, UpdateMeInput } from '@shared/schemas/me';
import { meKeys } from './get-me';

export const updateMe = (input: UpdateMeInput) => api<{ user: MeUser }>('/api/me', { method: 'PATCH', body: input });

export function useUpdateMe() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMe,
    onSuccess: ({ user }) => {
      queryClient.setQueryData<MeResponse>(meKeys.me, (old) => (old ? { ...old, user } : old));
    },
  });
}
