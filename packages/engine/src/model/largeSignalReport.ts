import type { ResolvedDesign } from '../design/designSchema.js';
import { CUTOFF_CURRENT, GRID_CURRENT_VGK } from './biasSolver.js';
import { harmonicsOfTransfer, type Harmonics } from './harmonics.js';
import { createLargeSignalStage, type LargeSignalPoint, type LargeSignalStage } from './largeSignal.js';
import { createSplitLoadLargeSignalStage } from './splitLoadLargeSignal.js';
import { nominalStageInputs, type StageInputs } from './stageEvaluator.js';

/** What ends the drive range: grid current (Vgk ≥ 0) or cut-off (Ia < 1 µA) of a section. */
export type DriveLimit = 'grid-current-1' | 'grid-current-2' | 'cut-off-1' | 'cut-off-2' | 'none';

/**
 * Largest drive and swing, and the distortion at a stated drive (volts peak at grid 1 / outputs).
 * Output 1 is plate 1 (the plate of a split-load), output 2 plate 2 (the cathode of a split-load).
 */
export interface LargeSignalReport {
  status: 'ok' | 'no-bias';
  /** Largest positive and negative grid-1 excursion before a limit (V), and the symmetrical one. */
  drivePositive: number;
  driveNegative: number;
  driveSymmetric: number;
  /** What ends the positive and the negative excursion. */
  limitPositive: DriveLimit;
  limitNegative: DriveLimit;
  /** Largest symmetrical peak swing at each output (V): min of its excursions at ±driveSymmetric. */
  swing1: number;
  swing2: number;
  /** Grid-1 drive (V peak) the distortion is stated at. */
  drive: number;
  /** Harmonics of each output's signal at `drive` (quasi-static transfer over one period, FFT). */
  out1: Harmonics | null;
  out2: Harmonics | null;
}

/** Drive scanned up to this many volts either way. */
const MAX_DRIVE = 400;

function limitOf(p: LargeSignalPoint | null): DriveLimit | 'fail' {
  if (!p) return 'fail';
  if (p.vgk1 >= GRID_CURRENT_VGK) return 'grid-current-1';
  if (p.vgk2 >= GRID_CURRENT_VGK) return 'grid-current-2';
  if (p.ia1 < CUTOFF_CURRENT) return 'cut-off-1';
  if (p.ia2 < CUTOFF_CURRENT) return 'cut-off-2';
  return 'none';
}

/** Edge of the drive range in direction `sign`: a growing scan, then bisection to 0.1 µV. */
function driveEdge(s: LargeSignalStage, sign: 1 | -1): { drive: number; limit: DriveLimit } {
  let ok = 0;
  let step = 0.05;
  let bad = Number.NaN;
  let limit: DriveLimit = 'none';
  while (ok < MAX_DRIVE) {
    const v = Math.min(ok + step, MAX_DRIVE);
    const l = limitOf(s.at(sign * v));
    if (l !== 'none') {
      bad = v;
      limit = l === 'fail' ? 'none' : l;
      break;
    }
    ok = v;
    step *= 1.5;
  }
  if (Number.isNaN(bad)) return { drive: ok, limit: 'none' };
  for (let it = 0; it < 80 && bad - ok > 1e-7; it++) {
    const mid = 0.5 * (ok + bad);
    const l = limitOf(s.at(sign * mid));
    if (l === 'none') ok = mid;
    else {
      bad = mid;
      if (l !== 'fail') limit = l;
    }
  }
  return { drive: ok, limit };
}

/**
 * Large-signal figures of a design (nominal parts, or kernel inputs `x`) from the quasi-static
 * triode model (createLargeSignalStage for the pair, createSplitLoadLargeSignalStage for the
 * split-load): the largest grid-1 drive either way before a section draws grid current (Vgk ≥ 0)
 * or cuts off (Ia < 1 µA), the largest symmetrical swing at each output (plates; plate and
 * cathode of a split-load), and H2, H3 and THD of each output at `drive` volts peak (default:
 * half the symmetrical drive limit), from 128 points over one period and an FFT (fft.js).
 * With `outputPeak` (V) instead, the drive is the one that gives output 1 a fundamental of that
 * many volts peak (secant on the FFT's H1), so two designs can be compared at one output level;
 * no harmonics when that drive is beyond the symmetrical limit.
 *
 * @example
 * largeSignalReport(design).out1?.thdPercent; // e.g. 0.8 (%)
 * largeSignalReport(design, { outputPeak: 20 }).out2?.thdPercent; // at 20 V peak on output 1
 */
export function largeSignalReport(
  design: ResolvedDesign,
  options: { drive?: number; x?: StageInputs; outputPeak?: number } = {},
): LargeSignalReport {
  const x = options.x ?? nominalStageInputs(design);
  const splitLoad = design.topology === 'split-load';
  const s = splitLoad ? createSplitLoadLargeSignalStage(design, x) : createLargeSignalStage(design, x);
  const out2Key = splitLoad ? 'vk' : 'va2';
  const rest = s.rest;
  const none = { out1: null, out2: null, swing1: NaN, swing2: NaN, drive: NaN };
  if (!rest || limitOf(rest) !== 'none')
    return {
      status: 'no-bias',
      ...{ drivePositive: NaN, driveNegative: NaN, driveSymmetric: NaN },
      ...{ limitPositive: 'none', limitNegative: 'none' },
      ...none,
    };
  const up = driveEdge(s, 1);
  const down = driveEdge(s, -1);
  const sym = Math.min(up.drive, down.drive);
  const hi = s.at(sym);
  const lo = s.at(-sym);
  const swing = (k: 'va1' | 'va2' | 'vk') =>
    hi && lo ? Math.min(Math.abs(hi[k] - rest[k]), Math.abs(lo[k] - rest[k])) : Number.NaN;
  const output = (k: 'va1' | 'va2' | 'vk') => (v: number) => (s.at(v)?.[k] ?? Number.NaN) - rest[k];
  const drive =
    options.outputPeak !== undefined
      ? driveForOutput(output('va1'), options.outputPeak, sym)
      : (options.drive ?? sym / 2);
  const ok = drive > 0 && drive <= sym;
  return {
    status: 'ok',
    ...{ drivePositive: up.drive, driveNegative: down.drive, driveSymmetric: sym },
    ...{ limitPositive: up.limit, limitNegative: down.limit },
    ...{ swing1: swing('va1'), swing2: swing(out2Key), drive },
    out1: ok ? harmonicsOfTransfer(output('va1'), drive, 128) : null,
    out2: ok ? harmonicsOfTransfer(output(out2Key), drive, 128) : null,
  };
}

/**
 * The drive (V peak) that gives `transfer` a fundamental of `peak` volts: secant on H1 from the
 * slope at rest, kept within (0, limit]. Returns Infinity when even the limit falls short.
 */
function driveForOutput(transfer: (v: number) => number, peak: number, limit: number): number {
  if (!(peak > 0 && limit > 0)) return Number.NaN;
  const h1 = (d: number) => harmonicsOfTransfer(transfer, d, 128).h1 - peak;
  if (h1(limit) < 0) return Number.POSITIVE_INFINITY;
  const slope = Math.abs(transfer(1e-4 * limit) - transfer(-1e-4 * limit)) / (2e-4 * limit);
  let d0 = Math.min(peak / slope, limit);
  let g0 = h1(d0);
  let d1 = Math.min(d0 * 1.01, limit);
  let g1 = h1(d1);
  for (let it = 0; it < 30 && Math.abs(g1) > 1e-9 * peak && g1 !== g0; it++) {
    const d2 = Math.min(Math.max(d1 - (g1 * (d1 - d0)) / (g1 - g0), 1e-9 * limit), limit);
    d0 = d1;
    g0 = g1;
    d1 = d2;
    g1 = h1(d1);
  }
  return d1;
}
