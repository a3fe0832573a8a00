import { queryOptions } from '@tanstack/react-query';
import { api } from '../client.js';

/** The signed-in user's workspace (any role may read it; admins change it). */
export const workspaceQueries = {
  all: ['workspace'] as const,
  detail: () =>
    queryOptions({
      queryKey: [...workspaceQueries.all, 'detail'] as const,
      queryFn: async () => (await api.admin.workspace()).workspace,
    }),
};
