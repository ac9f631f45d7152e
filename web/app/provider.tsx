import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { StrictMode, useState, type ReactNode } from 'react';
import { ToastProvider } from '../components/ui/toast';
import { createQueryClient } from '../lib/query-client';

/** Everything a screen expects above it; tests pass their own fresh query client. */
export function AppProvider({ children, queryClient }: { children: ReactNode; queryClient?: QueryClient }) {
  const [client] = useState(() => queryClient ?? createQueryClient());
  return (
    <StrictMode>
      <QueryClientProvider client={client}>
        <ToastProvider>{children}</ToastProvider>
      </QueryClientProvider>
    </StrictMode>
  );
}
