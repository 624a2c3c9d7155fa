import { QueryClientProvider } from '@tanstack/react-query';
import { useEffect, useState, type ReactNode } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { sessionQueryKey } from '../features/auth/api/get-session.ts';
import { api } from '../lib/api-client.ts';
import { createQueryClient } from '../lib/react-query.ts';

export function makeQueryClient(): QueryClient {
  const client: QueryClient = createQueryClient({
    // A 401 anywhere means the session is gone: re-read it so the guards send the member to sign in.
    onUnauthenticated: () => void client.invalidateQueries({ queryKey: sessionQueryKey }),
  });
  return client;
}

export function AppProvider({ children, queryClient }: { children: ReactNode; queryClient?: QueryClient }) {
  const [client] = useState(() => queryClient ?? makeQueryClient());

  // When the API client re-reads the session by itself (after a CSRF refusal), keep the cached copy in step.
  useEffect(() => api.onSessionRefreshed((session) => client.setQueryData(sessionQueryKey, session)), [client]);

  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
