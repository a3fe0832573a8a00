/**
 * Lots and test-limits calls (the lots part of the one fetch layer; the JSON calls go through
 * `request`, the multipart upload through fetch with a FormData body).
 */
import { queryOptions } from '@tanstack/react-query';
import type { LotSummary, TestLimitRates, GuardBandSuggestion } from '@sigmatail/engine';
import { ApiError, request, toApiError } from './client.js';

export type LotKind = 'resistor' | 'tube';
export type TubeQuantity = 'ia-gm' | 'mu-rp';

export interface LotListItem {
  id: string;
  name: string;
  kind: LotKind;
  quantity: 'ohms' | TubeQuantity;
  tubeType: string | null;
  testPoint: { va: number; vg: number } | null;
  fileName: string | null;
  count: number;
  createdAt: string;
  createdByName: string;
}

export interface LotDetail extends LotListItem {
  quantities: { key: string; label: string; unit: string; summary: LotSummary }[];
  sectionCorrelation: number | null;
}

export interface LotUpload {
  name: string;
  kind: LotKind;
  quantity?: TubeQuantity;
  tubeType?: string;
  va?: string;
  vg?: string;
  file: File | Blob;
  fileName?: string;
}

export interface Limits {
  low?: number;
  high?: number;
}

export interface TestLimitsRequest {
  process: { mean: number; sd: number } | { runId: string; metric: string };
  measurementSd: number;
  spec: Limits;
  test?: Limits;
  targetFalseAcceptPpm?: number;
  /** Keep as the chosen test limits of the run's design (process from a run only). */
  save?: boolean;
}

export interface TestLimitsAnswer {
  process: { mean: number; sd: number; runId?: string; metric?: string };
  spec: Limits;
  test: Limits;
  rates: TestLimitRates;
  suggestion: GuardBandSuggestion | null;
  /** Set when the limits were saved for the run's design. */
  saved?: { id: string } | null;
}

const enc = encodeURIComponent;

/** Uploads a lot as multipart/form-data (the server parses the CSV; row errors come back as issues). */
async function upload(u: LotUpload): Promise<{ lot: LotDetail }> {
  const fd = new FormData();
  fd.append('name', u.name);
  fd.append('kind', u.kind);
  if (u.kind === 'tube') {
    fd.append('quantity', u.quantity ?? 'ia-gm');
    fd.append('tubeType', u.tubeType ?? '');
    fd.append('va', u.va ?? '');
    fd.append('vg', u.vg ?? '');
  }
  fd.append('file', u.file, u.fileName ?? (u.file instanceof File ? u.file.name : 'lot.csv'));
  let res: Response;
  try {
    res = await fetch('/api/lots', { method: 'POST', credentials: 'same-origin', body: fd });
  } catch {
    throw new ApiError(0, 'Cannot reach the server. Check the connection and try again.');
  }
  if (!res.ok) throw await toApiError(res);
  return (await res.json()) as { lot: LotDetail };
}

export const lotsApi = {
  list: () => request<{ lots: LotListItem[] }>('GET', '/lots'),
  get: (id: string) => request<{ lot: LotDetail }>('GET', `/lots/${enc(id)}`),
  upload,
  remove: (id: string) => request<void>('DELETE', `/lots/${enc(id)}`),
  apply: (id: string, designId: string, target: string) =>
    request<{ designId: string; rev: number; warnings: string[] }>('POST', `/lots/${enc(id)}/apply`, {
      designId,
      target,
    }),
  testLimits: (body: TestLimitsRequest) => request<TestLimitsAnswer>('POST', '/test-limits', body),
};

export const lotQueries = {
  all: ['lots'] as const,
  list: () =>
    queryOptions({
      queryKey: [...lotQueries.all, 'list'] as const,
      queryFn: async () => (await lotsApi.list()).lots,
    }),
  detail: (id: string) =>
    queryOptions({
      queryKey: [...lotQueries.all, 'detail', id] as const,
      queryFn: async () => (await lotsApi.get(id)).lot,
    }),
};
