import { QueryClient, type QueryCache } from '@tanstack/react-query';
import { isApiError } from './api-error';

export function createQueryClient(queryCache?: QueryCache): QueryClient {
  return new QueryClient({
    ...(queryCache ? { queryCache } : {}),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        // Retry only what might succeed a second time: no answer, or the server failing.
        retry: (failureCount, error) => failureCount < 2 && (!isApiError(error) || error.status === 0 || error.status >= 500),
      },
      mutations: { retry: false },
    },
  });
}
