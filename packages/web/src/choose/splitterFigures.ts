import type { RunView } from '../api/types.js';
import { evaluateNominal } from '../design/useNominal.js';

/** What the splitter choice compares for one design (SI units; NaN where there is no figure). */
export interface SplitterFigures {
  name: string;
  topology: string;
  /** Why there are no figures (design does not parse or has no bias point), else null. */
  problem: string | null;
  /** Gain to output 1 (plate 1, or the plate of a split-load) and to output 2 (plate 2 or cathode). */
  gain1: number;
  gain2: number;
  balanceDb: number;
  zout1: number;
  zout2: number;
}

const TOPOLOGY_LABEL: Record<string, string> = {
  'cap-coupled': 'Long-tailed pair, capacitor-coupled',
  'direct-coupled': 'Long-tailed pair, direct-coupled',
  'split-load': 'Split-load (cathodyne)',
};

/**
 * The nominal figures of a stored design document, evaluated by the engine in the browser.
 *
 * @example splitterFigures(doc).balanceDb // dB
 */
export function splitterFigures(document: unknown): SplitterFigures {
  const topology = (document as { topology?: string } | null)?.topology ?? '';
  const name = (document as { name?: string } | null)?.name ?? '';
  const none = { gain1: NaN, gain2: NaN, balanceDb: NaN, zout1: NaN, zout2: NaN };
  const label = TOPOLOGY_LABEL[topology] ?? topology;
  const state = evaluateNominal(document);
  if (!state.ok) return { name, topology: label, problem: 'the design does not parse', ...none };
  const r = state.report;
  if (r.status !== 'ok') return { name, topology: label, problem: r.diagnosis ?? r.status, ...none };
  const m = r.metrics;
  return {
    ...{ name, topology: label, problem: null },
    ...{ gain1: m.a11, gain2: m.a12, balanceDb: m.balanceDb, zout1: m.zout1, zout2: m.zout2 },
  };
}

/**
 * The most recently finished of a design's runs with a joint yield, or null.
 *
 * @example latestDoneRun(runs)?.summary?.jointYield // 0.9996
 */
export function latestDoneRun(runs: readonly RunView[]): RunView | null {
  let best: RunView | null = null;
  for (const r of runs) {
    if (r.status !== 'done' || r.summary?.jointYield == null) continue;
    if (!best || (r.finishedAt ?? '') > (best.finishedAt ?? '')) best = r;
  }
  return best;
}
