/** Unit of a metric (SI; '' for dimensionless ratios and flags). */
export type MetricUnit = 'V' | 'A' | 'W' | 'Ω' | 'S' | 'dB' | '';

/** Description of one metric the stage kernel writes per sample. */
export interface MetricInfo {
  id: MetricId;
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
