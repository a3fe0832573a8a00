import type { ResolvedDesign } from '../design/designSchema.js';
import { CUTOFF_CURRENT, GRID_CURRENT_VGK } from './biasSolver.js';
import { harmonicsOfTransfer, type Harmonics } from './harmonics.js';
import { createLargeSignalStage, type LargeSignalPoint, type LargeSignalStage } from './largeSignal.js';
import { nominalStageInputs, type StageInputs } from './stageEvaluator.js';

/** What ends the drive range: grid current (Vgk ≥ 0) or cut-off (Ia < 1 µA) of a section. */
export type DriveLimit = 'grid-current-1' | 'grid-current-2' | 'cut-off-1' | 'cut-off-2' | 'none';

/** Largest drive and swing, and the distortion at a stated drive (volts peak at grid 1 / plates). */
export interface LargeSignalReport {
  status: 'ok' | 'no-bias';
  /** Largest positive and negative grid-1 excursion before a limit (V), and the symmetrical one. */
  drivePositive: number;
  driveNegative: number;
  driveSymmetric: number;
  /** What ends the positive and the negative excursion. */
  limitPositive: DriveLimit;
  limitNegative: DriveLimit;
  /** Largest symmetrical peak swing at each plate (V): min of its excursions at ±driveSymmetric. */
  swing1: number;
  swing2: number;
  /** Grid-1 drive (V peak) the distortion is stated at. */
  drive: number;
  /** Harmonics of each plate's signal at `drive` (quasi-static transfer over one period, FFT). */
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
 * triode model (see createLargeSignalStage): the largest grid-1 drive either way before either
 * section draws grid current (Vgk ≥ 0) or cuts off (Ia < 1 µA), the largest symmetrical swing at
 * each plate, and H2, H3 and THD of each plate signal at `drive` volts peak (default: half the
 * symmetrical drive limit), from 128 points over one period and an FFT (fft.js).
 *
 * @example
 * largeSignalReport(design).out1?.thdPercent; // e.g. 0.8 (%)
 */
export function largeSignalReport(
  design: ResolvedDesign,
  options: { drive?: number; x?: StageInputs } = {},
): LargeSignalReport {
  const s = createLargeSignalStage(design, options.x ?? nominalStageInputs(design));
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
  const swing = (k: 'va1' | 'va2') =>
    hi && lo ? Math.min(Math.abs(hi[k] - rest[k]), Math.abs(lo[k] - rest[k])) : Number.NaN;
  const drive = options.drive ?? sym / 2;
  const plate = (k: 'va1' | 'va2') => (v: number) => (s.at(v)?.[k] ?? Number.NaN) - rest[k];
  const ok = drive > 0 && drive <= sym;
  return {
    status: 'ok',
    ...{ drivePositive: up.drive, driveNegative: down.drive, driveSymmetric: sym },
    ...{ limitPositive: up.limit, limitNegative: down.limit },
    ...{ swing1: swing('va1'), swing2: swing('va2'), drive },
    out1: ok ? harmonicsOfTransfer(plate('va1'), drive, 128) : null,
    out2: ok ? harmonicsOfTransfer(plate('va2'), drive, 128) : null,
  };
}
