/** Unit of a metric (SI; '' for dimensionless ratios and flags). */
export type MetricUnit = 'V' | 'A' | 'W' | 'Ω' | 'S' | 'dB' | 'Hz' | '°' | '';

/** Description of one metric the stage kernel writes per sample. */
export interface MetricInfo {
  id: MetricId | CornerMetricId | AcMetricId;
  label: string;
  unit: MetricUnit;
  description: string;
}

/**
 * Metric ids in kernel output order. Gains are midband voltage gains with signs kept
 * (A12 = output 2 per volt at input 1).
 *
 * @example
 * METRIC_IDS.indexOf('balanceDb'); // column of the balance in the kernel output
 */
export const METRIC_IDS = [
  'a11',
  'a12',
  'a21',
  'a22',
  'gainDiff',
  'balanceDb',
  'zout1',
  'zout2',
  'zin',
  'gainDm',
  'gainCm',
  'cmrrDb',
  'ia1',
  'ia2',
  'va1',
  'va2',
  'vk',
  'vgk1',
  'vgk2',
  'pd1',
  'pd2',
  'vhk',
  'gm1',
  'gm2',
  'rp1',
  'rp2',
  'mu1',
  'mu2',
  'valid',
] as const;

/** One of {@link METRIC_IDS}. */
export type MetricId = (typeof METRIC_IDS)[number];

/**
 * The −3 dB points of each output (Hz). The kernel writes them after {@link METRIC_IDS} when the
 * design uses the frequency analysis (any capacitor part or frequency spec), so designs without
 * capacitors keep exactly their midband columns.
 *
 * @example
 * CORNER_METRIC_IDS[2]; // 'fHigh1'
 */
export const CORNER_METRIC_IDS = ['fLow1', 'fLow2', 'fHigh1', 'fHigh2'] as const;

/** One of {@link CORNER_METRIC_IDS}. */
export type CornerMetricId = (typeof CORNER_METRIC_IDS)[number];

/**
 * Metrics that apply at one frequency (grid 1 driven, grid 2 held by its bypass capacitor). The
 * kernel writes them as columns `id@f` (f in Hz; see {@link acColumnId}) for every spec frequency
 * and every {@link BAND_FREQUENCIES} entry (balance only).
 *
 * @example
 * acColumnId('acBalanceDb', 20000); // 'acBalanceDb@20000'
 */
export const AC_METRIC_IDS = ['acGain1', 'acGain2', 'acBalanceDb', 'acPhaseDeg'] as const;

/** One of {@link AC_METRIC_IDS}. */
export type AcMetricId = (typeof AC_METRIC_IDS)[number];

/**
 * Frequencies (Hz) of the balance band every run reports (1-2-5 steps, 10 Hz to 100 kHz): the
 * balance at each is a kernel column, so its median and 2.5/97.5 % envelope merge exactly over chunks.
 *
 * @example
 * BAND_FREQUENCIES[0]; // 10
 */
export const BAND_FREQUENCIES: readonly number[] = [
  10, 20, 50, 100, 200, 500, 1e3, 2e3, 5e3, 1e4, 2e4, 5e4, 1e5,
];

/**
 * The kernel column id of a frequency metric at f hertz.
 *
 * @example
 * acColumnId('acPhaseDeg', 20); // 'acPhaseDeg@20'
 */
export function acColumnId(metric: AcMetricId, frequency: number): string {
  return `${metric}@${frequency}`;
}

/**
 * The kernel column a spec reads: the metric id, or `id@f` for a frequency metric.
 *
 * @example
 * specColumnId({ metric: 'acBalanceDb', frequency: 2e4 }); // 'acBalanceDb@20000'
 */
export function specColumnId(spec: { metric: string; frequency?: number }): string {
  return spec.frequency === undefined ? spec.metric : `${spec.metric}@${spec.frequency}`;
}

const INFO: Record<MetricId, Omit<MetricInfo, 'id'>> = {
  a11: { label: 'A11', unit: '', description: 'Gain from grid 1 input to output 1 (plate 1), signed' },
  a12: { label: 'A12', unit: '', description: 'Gain from grid 1 input to output 2 (plate 2), signed' },
  a21: { label: 'A21', unit: '', description: 'Gain from grid 2 input to output 1, signed' },
  a22: { label: 'A22', unit: '', description: 'Gain from grid 2 input to output 2, signed' },
  gainDiff: {
    label: 'Differential gain',
    unit: '',
    description: 'A11 − A12: (vo1 − vo2) per volt at grid 1',
  },
  balanceDb: {
    label: 'Balance',
    unit: 'dB',
    description: '20·log10(|A12| / |A11|); 0 dB is perfect balance',
  },
  zout1: { label: 'Zout 1', unit: 'Ω', description: 'Impedance into output 1, its external load removed' },
  zout2: { label: 'Zout 2', unit: 'Ω', description: 'Impedance into output 2, its external load removed' },
  zin: { label: 'Zin', unit: 'Ω', description: 'Input impedance at grid 1 (grid leak bootstrapped)' },
  gainDm: {
    label: 'Differential-mode gain',
    unit: '',
    description: '(vo1 − vo2) / (vi1 − vi2) for antisymmetric drive: (A11 − A12 − A21 + A22) / 2',
  },
  gainCm: {
    label: 'Common-mode gain',
    unit: '',
    description: '((vo1 + vo2) / 2) / vcm for equal drive on both grids: (A11 + A12 + A21 + A22) / 2',
  },
  cmrrDb: {
    label: 'CMRR',
    unit: 'dB',
    description: '20·log10(|differential-mode gain| / |common-mode gain|)',
  },
  ia1: { label: 'Ia1', unit: 'A', description: 'Plate current, section 1' },
  ia2: { label: 'Ia2', unit: 'A', description: 'Plate current, section 2' },
  va1: { label: 'Va1', unit: 'V', description: 'Plate 1 voltage to ground' },
  va2: { label: 'Va2', unit: 'V', description: 'Plate 2 voltage to ground' },
  vk: { label: 'Vk', unit: 'V', description: 'Shared cathode voltage to ground' },
  vgk1: { label: 'Vgk1', unit: 'V', description: 'Grid-to-cathode voltage, section 1' },
  vgk2: { label: 'Vgk2', unit: 'V', description: 'Grid-to-cathode voltage, section 2' },
  pd1: { label: 'Pd1', unit: 'W', description: 'Plate dissipation Ia1·(Va1 − Vk)' },
  pd2: { label: 'Pd2', unit: 'W', description: 'Plate dissipation Ia2·(Va2 − Vk)' },
  vhk: { label: 'Vhk', unit: 'V', description: 'Cathode voltage relative to the heater' },
  gm1: { label: 'gm1', unit: 'S', description: 'Transconductance of section 1 at its bias' },
  gm2: { label: 'gm2', unit: 'S', description: 'Transconductance of section 2 at its bias' },
  rp1: { label: 'rp1', unit: 'Ω', description: 'Plate resistance of section 1 at its bias' },
  rp2: { label: 'rp2', unit: 'Ω', description: 'Plate resistance of section 2 at its bias' },
  mu1: { label: 'mu1', unit: '', description: 'Amplification factor gm·rp of section 1 at its bias' },
  mu2: { label: 'mu2', unit: '', description: 'Amplification factor gm·rp of section 2 at its bias' },
  valid: { label: 'Valid', unit: '', description: '1 when a bias point exists, else 0 (other metrics NaN)' },
};

/**
 * Metric descriptions in kernel output order (same order as {@link METRIC_IDS}).
 *
 * @example
 * METRICS.find((m) => m.id === 'zout1')?.unit; // 'Ω'
 */
export const METRICS: readonly MetricInfo[] = METRIC_IDS.map((id) => ({ id, ...INFO[id] }));

const CORNER_INFO: Record<CornerMetricId, Omit<MetricInfo, 'id'>> = {
  fLow1: {
    label: 'Low −3 dB, out 1',
    unit: 'Hz',
    description:
      'Frequency below midband where |vo1/vi1| is 3 dB under its midband value (0 when every coupling is ideal)',
  },
  fLow2: {
    label: 'Low −3 dB, out 2',
    unit: 'Hz',
    description: 'Frequency below midband where |vo2/vi1| is 3 dB under its midband value',
  },
  fHigh1: {
    label: 'High −3 dB, out 1',
    unit: 'Hz',
    description: 'Frequency above midband where |vo1/vi1| is 3 dB under its midband value',
  },
  fHigh2: {
    label: 'High −3 dB, out 2',
    unit: 'Hz',
    description: 'Frequency above midband where |vo2/vi1| is 3 dB under its midband value',
  },
};

/**
 * Descriptions of the −3 dB point metrics, in kernel order.
 *
 * @example
 * CORNER_METRICS[0].unit; // 'Hz'
 */
export const CORNER_METRICS: readonly MetricInfo[] = CORNER_METRIC_IDS.map((id) => ({
  id,
  ...CORNER_INFO[id],
}));

const AC_INFO: Record<AcMetricId, Omit<MetricInfo, 'id'>> = {
  acGain1: { label: 'Gain 1', unit: '', description: '|vo1/vi1| at the spec frequency (source to plate 1)' },
  acGain2: { label: 'Gain 2', unit: '', description: '|vo2/vi1| at the spec frequency (source to plate 2)' },
  acBalanceDb: {
    label: 'Balance',
    unit: 'dB',
    description: '20·log10(|vo2| / |vo1|) at the spec frequency; 0 dB is perfect balance',
  },
  acPhaseDeg: {
    label: 'Phase error',
    unit: '°',
    description:
      'Phase of vo2 relative to −vo1 at the spec frequency, in (−180°, 180°]; 0° is exact antiphase',
  },
};

/**
 * Descriptions of the frequency metrics (spec metric ids that take a frequency).
 *
 * @example
 * AC_METRICS.map((m) => m.id); // ['acGain1', 'acGain2', 'acBalanceDb', 'acPhaseDeg']
 */
export const AC_METRICS: readonly MetricInfo[] = AC_METRIC_IDS.map((id) => ({ id, ...AC_INFO[id] }));

/**
 * Label, unit and description of any kernel column, including `id@f` frequency columns
 * ('Balance at 20 kHz'); unknown ids come back with the id as label.
 *
 * @example
 * describeMetric('acBalanceDb@20000').label; // 'Balance at 20 kHz'
 */
export function describeMetric(id: string): Omit<MetricInfo, 'id'> {
  const at = id.indexOf('@');
  if (at > 0) {
    const base = AC_INFO[id.slice(0, at) as AcMetricId];
    const f = Number(id.slice(at + 1));
    if (base) return { ...base, label: `${base.label} at ${formatHz(f)}` };
  }
  return (
    INFO[id as MetricId] ??
    CORNER_INFO[id as CornerMetricId] ??
    AC_INFO[id as AcMetricId] ?? { label: id, unit: '', description: '' }
  );
}

/** '20 Hz', '1 kHz', '20 kHz', '1.5 MHz'. */
function formatHz(f: number): string {
  if (f >= 1e6) return `${Number((f / 1e6).toPrecision(4))} MHz`;
  if (f >= 1e3) return `${Number((f / 1e3).toPrecision(4))} kHz`;
  return `${Number(f.toPrecision(4))} Hz`;
}
