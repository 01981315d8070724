import { useMutation } from '@tanstack/react-query';
import { api, rememberCsrfToken } from '../../../lib/api-client';

export const signOut = () => api<void>('/auth/logout', { method: 'POST' });

/**
 * Ends the session on the server, then loads the start page afresh: nothing cached for the
 * signed-in user survives, and no open page refetches its private data as a stranger.
 */
export function useSignOut() {
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      rememberCsrfToken(null);
      window.location.assign('/');
    },
  });
}
