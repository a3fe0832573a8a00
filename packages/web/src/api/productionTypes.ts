import type {
  AgeingResult,
  AgeingScenario,
  EnvelopeRule,
  PairingComparison,
  PlanSearchResult,
  PriceTable,
} from '@sigmatail/engine';

export type { AgeingResult, AgeingScenario, EnvelopeRule, PairingComparison, PlanSearchResult, PriceTable };

/** A saved tolerance plan as GET /api/plans/:id answers it. */
export interface SavedPlan {
  id: string;
  designId: string;
  designName: string;
  revision: number;
  target: { targetPpm: number; confidence: number; samples: number; seed: string };
  result: PlanSearchResult;
  assignment: PlanSearchResult['frontier'][number]['assignment'] | null;
  confirmRevision: number | null;
  confirm: {
    runId: string;
    status: string;
    samples: number;
    seed: string;
    revision: number;
    rejectPpm: number | null;
    lowPpm: number | null;
    highPpm: number | null;
  } | null;
  createdAt: string;
}

/** POST /api/plans body. */
export interface PlanRequest {
  designId: string;
  targetPpm?: number;
  targetYield?: number;
  confidence: number;
  samples: number;
  seed?: string;
  confirmSamples: number;
}

/** A saved pairing comparison or ageing result. */
export interface SavedStudy<R> {
  id: string;
  design_id: string;
  revision: number;
  kind: 'pairing' | 'ageing';
  input: unknown;
  result: R;
  created_at: string;
}
export type PairingStudy = SavedStudy<PairingComparison & { currency: string }>;
export type AgeingStudy = SavedStudy<AgeingResult>;
