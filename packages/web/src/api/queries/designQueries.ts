import { queryOptions } from '@tanstack/react-query';
import { api } from '../client.js';
import type { ArchivedFilter } from '../types.js';

export const designQueries = {
  all: ['designs'] as const,
  list: (q: string, archived: ArchivedFilter = 'exclude') =>
    queryOptions({
      queryKey: [...designQueries.all, 'list', { q, archived }] as const,
      queryFn: async () => (await api.designs.list(q, archived)).designs,
    }),
  detail: (id: string) =>
    queryOptions({
      queryKey: [...designQueries.all, 'detail', id] as const,
      queryFn: async () => (await api.designs.get(id)).design,
    }),
  revisions: (id: string) =>
    queryOptions({
      queryKey: [...designQueries.all, 'detail', id, 'revisions'] as const,
      queryFn: async () => (await api.designs.revisions(id)).revisions,
    }),
  revision: (id: string, rev: number) =>
    queryOptions({
      queryKey: [...designQueries.all, 'detail', id, 'revisions', rev] as const,
      queryFn: async () => (await api.designs.revision(id, rev)).revision,
      staleTime: Infinity, // a saved revision never changes
    }),
};
