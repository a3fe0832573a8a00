import { request } from './client.js';
import type {
  AgeingScenario,
  AgeingStudy,
  EnvelopeRule,
  PairingStudy,
  PlanRequest,
  PriceTable,
  SavedPlan,
} from './productionTypes.js';

const enc = encodeURIComponent;

/** Production planning calls: price table, tolerance plans, pairing comparisons, ageing. */
export const productionApi = {
  prices: () => request<{ prices: PriceTable | null; updatedAt: string | null }>('GET', '/prices'),
  savePrices: (prices: PriceTable) => request<{ prices: PriceTable }>('PUT', '/prices', prices),
  plans: (designId?: string) =>
    request<{ plans: SavedPlan[] }>('GET', `/plans${designId ? `?designId=${enc(designId)}` : ''}`),
  plan: (id: string) => request<{ plan: SavedPlan }>('GET', `/plans/${enc(id)}`),
  createPlan: (body: PlanRequest) => request<{ plan: SavedPlan }>('POST', '/plans', body),
  comparePairing: (body: {
    designId: string;
    strategies: EnvelopeRule[];
    samples: number;
    seed?: string;
    lot?: { quantity: 'ia' | 'gm' | 'mu'; sections: [number, number][] };
    /** A stored tube lot of the workspace (instead of `lot`). */
    lotId?: string;
  }) => request<{ study: PairingStudy }>('POST', '/pairing', body),
  latestPairing: (designId: string) =>
    request<{ study: PairingStudy }>('GET', `/pairing/latest?designId=${enc(designId)}`),
  age: (body: { designId: string; scenario: AgeingScenario; samples: number; seed?: string }) =>
    request<{ study: AgeingStudy }>('POST', '/ageing', body),
  latestAgeing: (designId: string) =>
    request<{ study: AgeingStudy }>('GET', `/ageing/latest?designId=${enc(designId)}`),
};
