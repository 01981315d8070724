import { useState, type ReactNode } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { makeQueryClient } from '../lib/query-client';
import { UnitsProvider } from '../lib/units';

export function AppProvider({ children }: { children: ReactNode }) {
  const [queryClient] = useState(makeQueryClient);
  return (
    <QueryClientProvider client={queryClient}>
      <UnitsProvider>{children}</UnitsProvider>
    </QueryClientProvider>
  );
}
