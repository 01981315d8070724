import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, isOffline, rememberCsrfToken } from '../../../lib/api-client';
import { keepForReader, readForReader, rememberReader } from '../../../lib/device-copy';
import type { MeResponse, MeUser } from '@shared/schemas/me';

export const meKeys = {
  me: ['me'] as const,
};

/** Reads who is signed in, and keeps the session's CSRF token for the API client. */
export async function getMe(): Promise<MeResponse> {
  try {
    const me = await api<MeResponse>('/api/me');
    rememberCsrfToken(me.csrfToken);
    rememberReader(me.user?.id ?? null);
    if (me.user) keepForReader('me', me.user);
    return me;
  } catch (err) {
    // without a connection the reader last signed in on this device is still who reads (no token: no changes)
    const user = isOffline(err) ? readForReader<MeUser>('me') : undefined;
    if (user) return { user, csrfToken: null };
    throw err;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: meKeys.me,
    queryFn: getMe,
    staleTime: 5 * 60_000,
  });

export const useMe = () => useQuery(meQueryOptions());
