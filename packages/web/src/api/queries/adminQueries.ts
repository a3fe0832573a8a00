import { queryOptions } from '@tanstack/react-query';
import { api } from '../client.js';

export const adminQueries = {
  all: ['admin'] as const,
  users: () =>
    queryOptions({
      queryKey: [...adminQueries.all, 'users'] as const,
      queryFn: () => api.admin.users(),
    }),
  inbox: () =>
    queryOptions({
      queryKey: [...adminQueries.all, 'inbox'] as const,
      queryFn: async () => (await api.admin.inbox()).messages,
    }),
  inboxMessage: (id: string) =>
    queryOptions({
      queryKey: [...adminQueries.all, 'inbox', id] as const,
      queryFn: async () => (await api.admin.inboxMessage(id)).message,
    }),
  audit: () =>
    queryOptions({
      queryKey: [...adminQueries.all, 'audit'] as const,
      queryFn: async () => (await api.admin.audit()).events,
    }),
};
