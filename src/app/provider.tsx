import { useState, type ReactNode } from 'react';
import { QueryClientProvider, hydrate, type DehydratedState, type QueryClient } from '@tanstack/react-query';
import { makeQueryClient } from '../lib/query-client';
import { UnitsProvider } from '../lib/units';

/**
 * The query cache and the units for every page. `dehydratedState` is what the server fetched to render the
 * page (so the first render shows the same data without asking again); the server passes its own `client`.
 */
export function AppProvider({
  children,
  dehydratedState,
  client,
}: {
  children: ReactNode;
  dehydratedState?: DehydratedState;
  client?: QueryClient;
}) {
  const [queryClient] = useState(() => {
    const qc = client ?? makeQueryClient();
    if (dehydratedState) hydrate(qc, dehydratedState);
    return qc;
  });
  return (
    <QueryClientProvider client={queryClient}>
      <UnitsProvider>{children}</UnitsProvider>
    </QueryClientProvider>
  );
}
