import { largeSignalReport } from '@sigmatail/engine';
import type { RunView } from '../api/types.js';
import { evaluateNominal } from '../design/useNominal.js';
import { topologyLabel } from '../format/topologyLabel.js';

/**
 * Output level (V peak at output 1) the distortion of both designs is stated at: one level for
 * both, so the figures compare like with like; reached by either splitter in common use.
 */
export const DISTORTION_OUTPUT_PEAK = 20;

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
  /** Largest symmetrical swing at each output before grid current or cut-off (V peak). */
  swing1: number;
  swing2: number;
  /** THD of each output (%) with output 1 at DISTORTION_OUTPUT_PEAK; NaN beyond the swing. */
  thd1Percent: number;
  thd2Percent: number;
  /** Grid drive that output level takes (V peak); Infinity when it is beyond the swing. */
  drive: number;
}

/**
 * The nominal figures of a stored design document, evaluated by the engine in the browser: the
 * small signal, and the large signal (swing of each output, THD of each output with output 1 at
 * {@link DISTORTION_OUTPUT_PEAK} V peak) from the quasi-static triode model.
 *
 * @example splitterFigures(doc).balanceDb // dB
 */
export function splitterFigures(document: unknown): SplitterFigures {
  const topology = (document as { topology?: string } | null)?.topology ?? '';
  const name = (document as { name?: string } | null)?.name ?? '';
  const none = {
    ...{ gain1: NaN, gain2: NaN, balanceDb: NaN, zout1: NaN, zout2: NaN },
    ...{ swing1: NaN, swing2: NaN, thd1Percent: NaN, thd2Percent: NaN, drive: NaN },
  };
  const label = topologyLabel(topology);
  const state = evaluateNominal(document);
  if (!state.ok) return { name, topology: label, problem: 'the design does not parse', ...none };
  const r = state.report;
  if (r.status !== 'ok') return { name, topology: label, problem: r.diagnosis ?? r.status, ...none };
  const m = r.metrics;
  const ls = largeSignalReport(state.design, { outputPeak: DISTORTION_OUTPUT_PEAK });
  return {
    ...{ name, topology: label, problem: null },
    ...{ gain1: m.a11, gain2: m.a12, balanceDb: m.balanceDb, zout1: m.zout1, zout2: m.zout2 },
    ...{ swing1: ls.swing1, swing2: ls.swing2, drive: ls.drive },
    thd1Percent: ls.out1?.thdPercent ?? NaN,
    thd2Percent: ls.out2?.thdPercent ?? NaN,
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
