import { QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-error';

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        // Opening the quote records a view: fetch it once per visit, not on every focus.
        staleTime: Infinity,
        refetchOnWindowFocus: false,
        retry: (failureCount, error) => failureCount < 2 && (!isApiError(error) || error.status === 0 || error.status >= 500),
      },
      mutations: { retry: false },
    },
  });
}
