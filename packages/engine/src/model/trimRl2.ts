import type { ResolvedDesign } from '../design/designSchema.js';
import { snapToSeries } from '../values/eSeries.js';
import { createStagePoint } from './stagePoint.js';

/** A trim candidate: RL2 (Ω) and the balance it leaves (dB). */
export interface TrimValue {
  rl2: number;
  balanceDb: number;
}

/** The RL2 that balances the outputs, and the nearest E24 and E96 values. */
export interface TrimResult {
  /** Exact RL2 zeroing the imbalance (Ω), or NaN when none exists in [RL2/10, 10·RL2]. */
  exact: TrimValue;
  e24: TrimValue;
  e96: TrimValue;
}

/**
 * Finds the RL2 (Ω) that makes |A12| = |A11| at nominal, with the full model: each trial value
 * re-solves the bias point (RL2 moves plate 2's voltage, so its rp and gm) and the exact small
 * signal including loads and grid leaks. Bisection on log(RL2), where the balance rises
 * monotonically with RL2. Also reports the nearest E24 and E96 values and the imbalance each leaves.
 *
 * @example
 * trimRl2(design).e24; // { rl2: 91000, balanceDb: 0.04 }
 */
export function trimRl2(design: ResolvedDesign): TrimResult {
  const at = createStagePoint(design);
  const balance = (rl2: number) => at({ rl2 }).balanceDb;
  // The schema requires RL2 for a long-tailed pair; only a split-load design (no trim) lacks it.
  const rl2 = design.parts.rl2?.value ?? Number.NaN;
  let lo = rl2 / 10;
  let hi = rl2 * 10;
  let flo = balance(lo);
  const fhi = balance(hi);
  let exact = Number.NaN;
  if (flo <= 0 && fhi >= 0) {
    for (let k = 0; k < 100 && hi / lo - 1 > 1e-13; k++) {
      const mid = Math.sqrt(lo * hi);
      const f = balance(mid);
      if (f < 0 === flo < 0) {
        lo = mid;
        flo = f;
      } else hi = mid;
    }
    exact = Math.sqrt(lo * hi);
  }
  const near = (series: 'E24' | 'E96'): TrimValue => {
    if (!Number.isFinite(exact)) return { rl2: Number.NaN, balanceDb: Number.NaN };
    const v = snapToSeries(exact, series);
    return { rl2: v, balanceDb: balance(v) };
  };
  return {
    exact: { rl2: exact, balanceDb: Number.isFinite(exact) ? balance(exact) : Number.NaN },
    e24: near('E24'),
    e96: near('E96'),
  };
}
