import { queryOptions } from '@tanstack/react-query';
import { ApiError } from '../client.js';
import { productionApi } from '../productionApi.js';

/** null when nothing is saved yet (404), so a page can say so instead of failing. */
const orNull = async <T>(p: Promise<T>): Promise<T | null> => {
  try {
    return await p;
  } catch (err) {
    if (err instanceof ApiError && err.status === 404) return null;
    throw err;
  }
};

export const productionQueries = {
  all: ['production'] as const,
  prices: () =>
    queryOptions({
      queryKey: [...productionQueries.all, 'prices'] as const,
      queryFn: () => productionApi.prices(),
    }),
  plans: () =>
    queryOptions({
      queryKey: [...productionQueries.all, 'plans', 'list'] as const,
      queryFn: async () => (await productionApi.plans()).plans,
    }),
  /** Polls every 2 s while the confirming run is still going. */
  plan: (id: string) =>
    queryOptions({
      queryKey: [...productionQueries.all, 'plans', 'detail', id] as const,
      queryFn: async () => (await productionApi.plan(id)).plan,
      refetchInterval: (q) => {
        const s = q.state.data?.confirm?.status;
        return s && !['done', 'failed', 'cancelled'].includes(s) ? 2000 : false;
      },
    }),
  latestPairing: (designId: string) =>
    queryOptions({
      queryKey: [...productionQueries.all, 'pairing', designId] as const,
      queryFn: async () => (await orNull(productionApi.latestPairing(designId)))?.study ?? null,
    }),
  latestAgeing: (designId: string) =>
    queryOptions({
      queryKey: [...productionQueries.all, 'ageing', designId] as const,
      queryFn: async () => (await orNull(productionApi.latestAgeing(designId)))?.study ?? null,
    }),
};
