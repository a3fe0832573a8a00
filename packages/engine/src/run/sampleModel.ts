import type { Sfc32 } from '../random/sfc32.js';
import type { PairingTally } from '../spread/tubeSpread.js';

/**
 * What the statistics need from a model: the contract's stage kernel shape, generic over input and
 * metric names so the machinery is tested on reference functions too.
 */
export interface Kernel {
  readonly inputs: readonly string[];
  readonly metrics: readonly string[];
  nominalInputs(): Float64Array;
  /** In place, allocation-free: inputs[i][s] is input i of sample s; writes out[m][s] for s < n. */
  evaluate(inputs: readonly Float64Array[], n: number, out: readonly Float64Array[]): void;
}

/** Per kernel input: nominal and extreme values (worst case, tornado); varied = has a spread. */
export type InputRange = { input: string; nominal: number; low: number; high: number; varied: boolean };

/**
 * A kernel plus how independent uniform draws become its inputs. `dims` names the independent
 * draw dimensions (a part, or a tube section's own noise); variance-based indices are stated per
 * draw dimension.
 */
export interface SampleModel {
  readonly kernel: Kernel;
  readonly dims: readonly string[];
  /**
   * In place: turns u[j][s] in (0,1) into inputs[i][s] for s < n. `redraw` feeds pairing
   * rejection (null = ignore pairing rules); `tally` counts the draws.
   */
  fillInputs(
    u: readonly Float64Array[],
    n: number,
    inputs: readonly Float64Array[],
    redraw: Sfc32 | null,
    tally: PairingTally,
  ): void;
  /** Per kernel input, in kernel input order. */
  readonly ranges: readonly InputRange[];
  /** Quantile of input i's marginal at probability p, for inputs with a one-dimensional spread. */
  inputQuantile(input: number, p: number): number;
}
