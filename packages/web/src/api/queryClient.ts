import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './client.js';

/** The app's one QueryClient. Client errors (4xx) are not retried: asking again will not help. */
export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 10_000,
      retry: (count, error) => !(error instanceof ApiError && error.status < 500) && count < 2,
    },
  },
});
