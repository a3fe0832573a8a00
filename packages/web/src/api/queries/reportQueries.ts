import { queryOptions } from '@tanstack/react-query';
import { api } from '../client.js';

/** Production reports, one per design (gathered fresh by the server on each read). */
export const reportQueries = {
  all: ['reports'] as const,
  detail: (designId: string) =>
    queryOptions({
      queryKey: [...reportQueries.all, 'detail', designId] as const,
      queryFn: async () => (await api.reports.get(designId)).report,
    }),
};
