import type { ResolvedDesign } from '../design/designSchema.js';
import {
  AC_CG2,
  AC_CIN,
  AC_COUT1,
  AC_COUT2,
  AC_CSTRAY1,
  AC_CSTRAY2,
  H1_IM,
  H1_RE,
  H2_IM,
  H2_RE,
} from './acResponse.js';
import { acColumnId, BAND_FREQUENCIES, type AcMetricId } from './metrics.js';
import type { nominalStageInputs } from './stageEvaluator.js';

/** Column slots per frequency: gain 1, gain 2, balance, phase (-1 = not a column). */
const AC_PER_FREQ = 4;

/**
 * The frequency columns of a design: distinct frequencies (spec frequencies, then the band), and
 * per frequency the output column of each frequency metric or -1. `first` is the output column of
 * the first frequency column. Shared by every topology's kernel.
 *
 * @example
 * acColumns(design, true, METRIC_IDS.length).ids; // ['acGain1@20000', …, 'acBalanceDb@10', …]
 */
export function acColumns(
  design: ResolvedDesign,
  band: boolean,
  first: number,
): { ids: string[]; frequencies: Float64Array; columns: Int32Array } {
  const wanted: { metric: AcMetricId; f: number }[] = [];
  const AC: readonly AcMetricId[] = ['acGain1', 'acGain2', 'acBalanceDb', 'acPhaseDeg'];
  for (const spec of design.specs)
    if (spec.frequency !== undefined) for (const m of AC) wanted.push({ metric: m, f: spec.frequency });
  if (band) for (const f of BAND_FREQUENCIES) wanted.push({ metric: 'acBalanceDb', f });
  const freqs: number[] = [];
  const ids: string[] = [];
  const cols: number[] = [];
  for (const { metric, f } of wanted) {
    const id = acColumnId(metric, f);
    if (ids.includes(id)) continue;
    let fi = freqs.indexOf(f);
    if (fi < 0) {
      fi = freqs.length;
      freqs.push(f);
      cols.push(-1, -1, -1, -1);
    }
    cols[fi * AC_PER_FREQ + AC.indexOf(metric)] = first + ids.length;
    ids.push(id);
  }
  return { ids, frequencies: Float64Array.from(freqs), columns: Int32Array.from(cols) };
}

/**
 * Writes the frequency columns of frequency index fi for sample s from the response in h (H_*
 * slots): |H1|, |H2|, 20·log10|H2/H1| (dB) and the phase of H2 against −H1 (degrees); NaN when
 * the solve failed (`ok` false).
 *
 * @example
 * writeAcColumns(out, cols.columns, 0, s, acResponseArr(true, false, v, 20e3, h), h);
 */
export function writeAcColumns(
  out: readonly Float64Array[],
  columns: Int32Array,
  fi: number,
  s: number,
  ok: boolean,
  h: Float64Array,
): void {
  const h1r = ok ? h[H1_RE] : Number.NaN;
  const h1i = ok ? h[H1_IM] : Number.NaN;
  const h2r = ok ? h[H2_RE] : Number.NaN;
  const h2i = ok ? h[H2_IM] : Number.NaN;
  const m1 = h1r * h1r + h1i * h1i;
  const m2 = h2r * h2r + h2i * h2i;
  const base = fi * AC_PER_FREQ;
  let c = columns[base];
  if (c >= 0) out[c][s] = Math.sqrt(m1);
  c = columns[base + 1];
  if (c >= 0) out[c][s] = Math.sqrt(m2);
  c = columns[base + 2];
  if (c >= 0) out[c][s] = 10 * Math.log10(m2 / m1);
  c = columns[base + 3];
  // Phase of vo2 against −vo1: arg(vo2 · conj(−vo1)).
  if (c >= 0) out[c][s] = (Math.atan2(-(h2i * h1r - h2r * h1i), -(h2r * h1r + h2i * h1i)) * 180) / Math.PI;
}

/**
 * Writes the nominal capacitor values (F; Infinity = ideal coupling, 0 = no stray) into the
 * AC_* slots of a circuit array.
 *
 * @example
 * writeNominalCapacitors(nominalStageInputs(design), v);
 */
export function writeNominalCapacitors(x: ReturnType<typeof nominalStageInputs>, v: Float64Array): void {
  v[AC_CIN] = x.cin;
  v[AC_CG2] = x.cg2;
  v[AC_COUT1] = x.cout1;
  v[AC_COUT2] = x.cout2;
  v[AC_CSTRAY1] = x.cstray1;
  v[AC_CSTRAY2] = x.cstray2;
}
