import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, rememberCsrfToken } from '../../../lib/api-client';
import type { MeResponse } from '@shared/schemas/me';

export const meKeys = {
  me: ['me'] as const,
};

/** Reads who is signed in, and keeps the session's CSRF token for the API client. */
export async function getMe(): Promise<MeResponse> {
  const me = await api<MeResponse>('/api/me');
  rememberCsrfToken(me.csrfToken);
  return me;
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: meKeys.me,
    queryFn: getMe,
    staleTime: 5 * 60_000,
  });

export const useMe = () => useQuery(meQueryOptions());
