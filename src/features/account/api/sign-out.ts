import { useMutation } from '@tanstack/react-query';
import { api, rememberCsrfToken } from '../../../lib/api-client';
import { forgetReader } from '../../../lib/device-copy';

export const signOut = () => api<void>('/auth/logout', { method: 'POST' });
/** Ends every session of the member (other browsers and devices too), this one included. */
export const signOutEverywhere = () => api<void>('/auth/logout/everywhere', { method: 'POST' });

/**
 * Ends the session (or all of them) on the server, then loads the start page afresh: nothing cached
 * for the signed-in user survives, and no open page refetches its private data as a stranger.
 */
export function useSignOut() {
  return useMutation({
    mutationFn: (where: 'here' | 'everywhere' = 'here') => (where === 'everywhere' ? signOutEverywhere() : signOut()),
    onSuccess: () => {
      rememberCsrfToken(null);
      forgetReader();
      window.location.assign('/');
    },
  });
}
