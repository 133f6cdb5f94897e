import { QueryCache, QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { isApiError } from '../lib/api-error';
import { createQueryClient } from '../lib/query-client';
import { sessionKeys } from '../features/session/api/session-keys';

/**
 * The app's query client. A 401 from any screen's query means the session has ended: the cached
 * user is cleared and the shell sends the person back to sign in.
 */
export function createAppQueryClient(): QueryClient {
  const queryClient: QueryClient = createQueryClient(
    new QueryCache({
      onError: (error, query) => {
        if (isApiError(error) && error.status === 401 && query.queryKey[0] !== sessionKeys.all[0]) {
          queryClient.setQueryData(sessionKeys.current(), null);
        }
      },
    }),
  );
  return queryClient;
}

export function Providers({ queryClient, children }: { queryClient: QueryClient; children: ReactNode }) {
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
