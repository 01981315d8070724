import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

export function makeQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 60_000,
        // a 4xx will not get better by asking again
        retry: (count, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 2,
        refetchOnWindowFocus: false,
        // ask even without a connection: the service worker and the device copies answer what was kept
        networkMode: 'offlineFirst',
      },
    },
  });
}
