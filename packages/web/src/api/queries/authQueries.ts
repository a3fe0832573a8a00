import { queryOptions } from '@tanstack/react-query';
import { api, ApiError } from '../client.js';

/** The signed-in user, or null when there is no session (401 is an answer, not an error). */
export const authQueries = {
  all: ['auth'] as const,
  me: () =>
    queryOptions({
      queryKey: [...authQueries.all, 'me'] as const,
      queryFn: async () => {
        try {
          return (await api.auth.me()).user;
        } catch (e) {
          if (e instanceof ApiError && e.status === 401) return null;
          throw e;
        }
      },
      staleTime: 60_000,
    }),
  invite: (token: string) =>
    queryOptions({
      queryKey: [...authQueries.all, 'invite', token] as const,
      queryFn: async () => (await api.auth.invite(token)).invite,
    }),
};
