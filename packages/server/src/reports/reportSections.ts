import {
  ruleLabel,
  type AgeingResult,
  type PairingComparison,
  type PlanSearchResult,
} from '@sigmatail/engine';
import type { presentPlan } from '../production/presentPlan.js';
import type { latestStudy } from '../production/productionRepo.js';
import type { ReportAgeing, ReportLimits, ReportPairing, ReportPlan } from './productionReport.js';

type Study = NonNullable<Awaited<ReturnType<typeof latestStudy>>>;
type Plan = Awaited<ReturnType<typeof presentPlan>>;

const iso = (d: Date | string) => new Date(d).toISOString();
const interval = (x: { rejectPpm: number; lowPpm: number; highPpm: number }) => ({
  ppm: x.rejectPpm,
  lowPpm: x.lowPpm,
  highPpm: x.highPpm,
});

/** The report's view of a saved plan (see presentPlan). */
export function reportPlan(p: Plan): ReportPlan {
  const result = p.result as PlanSearchResult;
  const chosen = result.chosen;
  const c = p.confirm;
  return {
    id: p.id,
    createdAt: iso(p.createdAt),
    targetPpm: result.targetPpm,
    currency: result.currency,
    chosen: chosen && {
      classes: chosen.assignment.classes,
      tube: chosen.assignment.tube,
      cost: chosen.cost,
      estimate: interval(chosen),
    },
    confirm: c && {
      runId: c.runId,
      status: c.status,
      samples: c.samples,
      result:
        c.rejectPpm === null || c.lowPpm === null || c.highPpm === null
          ? null
          : { ppm: c.rejectPpm, lowPpm: c.lowPpm, highPpm: c.highPpm },
    },
  };
}

/** The report's view of a saved pairing comparison. */
export function reportPairing(s: Study): ReportPairing {
  const r = s.result as PairingComparison & { currency?: string };
  return {
    createdAt: iso(s.created_at),
    revision: s.revision,
    currency: r.currency ?? null,
    lotSize: r.lotSize,
    strategies: r.outcomes.map((o) => ({
      label: ruleLabel(o.rule),
      reject: interval(o),
      costPerGoodUnit: o.costPerGoodUnit,
      tubesThrownPerUnit: o.tubesThrownPerUnit,
    })),
  };
}

/** The report's view of a saved ageing result: margins after ageing. */
export function reportAgeing(s: Study): ReportAgeing {
  const r = s.result as AgeingResult;
  return {
    createdAt: iso(s.created_at),
    revision: s.revision,
    asNew: interval(r.asNew),
    aged: interval(r.aged),
    specs: r.aged.specs.map((m) => ({
      label: m.label ?? (m.frequency === null ? m.metric : `${m.metric} at ${m.frequency} Hz`),
      margin: m.margin,
      marginSd: Number.isFinite(m.marginSd) ? m.marginSd : null,
    })),
  };
}

type LimitsAnswer = {
  process: { metric?: string };
  measurementSd: number;
  spec: { low?: number; high?: number };
  test: { low?: number; high?: number };
  rates: { falseAccept: number; falseReject: number };
  suggestion: { guardBand: number; reached: boolean } | null;
};

/** The report's view of saved test limits. */
export function reportLimits(s: Study): ReportLimits {
  const r = s.result as LimitsAnswer;
  return {
    createdAt: iso(s.created_at),
    metric: r.process.metric ?? null,
    measurementSd: r.measurementSd,
    spec: r.spec,
    test: r.test,
    falseAcceptPpm: r.rates.falseAccept * 1e6,
    falseRejectPpm: r.rates.falseReject * 1e6,
    guardBand: r.suggestion?.reached ? r.suggestion.guardBand : null,
  };
}
