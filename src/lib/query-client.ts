import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

/** The app's query cache; on the server (one per rendered page) a failed query is not retried: the browser will. */
export function makeQueryClient({ server = false } = {}) {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 60_000,
        // a 4xx will not get better by asking again
        retry: server
          ? false
          : (count, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 2,
        refetchOnWindowFocus: false,
        // ask even without a connection: the service worker and the device copies answer what was kept
        networkMode: 'offlineFirst',
      },
    },
  });
}
