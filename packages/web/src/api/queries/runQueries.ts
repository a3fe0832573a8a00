import { queryOptions } from '@tanstack/react-query';
import { api } from '../client.js';
import { isFinished } from '../runStatus.js';

export const runQueries = {
  all: ['runs'] as const,
  list: (filter: { designId?: string; status?: string } = {}) =>
    queryOptions({
      queryKey: [...runQueries.all, 'list', filter] as const,
      queryFn: async () => (await api.runs.list(filter)).runs,
    }),
  /** Polls once a second while the run is queued or running, then stops. */
  detail: (id: string) =>
    queryOptions({
      queryKey: [...runQueries.all, 'detail', id] as const,
      queryFn: async () => (await api.runs.get(id)).run,
      refetchInterval: (q) => (q.state.data && isFinished(q.state.data.status) ? false : 1000),
    }),
  results: (id: string) =>
    queryOptions({
      queryKey: [...runQueries.all, 'detail', id, 'results'] as const,
      queryFn: () => api.runs.results(id),
      staleTime: Infinity, // results of a finished run are immutable
    }),
  /** The first raw samples of a run (regenerated from its seed), for scatter plots. */
  samples: (id: string, maxRows: number) =>
    queryOptions({
      queryKey: [...runQueries.all, 'detail', id, 'samples', maxRows] as const,
      queryFn: () => api.runs.sampleHead(id, maxRows),
      staleTime: Infinity,
    }),
};
