import { METRICS, type MetricInfo } from '@sigmatail/engine';

const BY_ID = new Map(METRICS.map((m) => [m.id as string, m]));

/** Label and unit of a metric id; unknown ids show as themselves without a unit. */
export function metricInfo(id: string): Pick<MetricInfo, 'label' | 'unit' | 'description'> {
  return BY_ID.get(id) ?? { label: id, unit: '', description: '' };
}

/** Metrics worth plotting (the bias-point flag is not). */
export const PLOTTABLE = METRICS.filter((m) => m.id !== 'valid').map((m) => m.id as string);

/** Input ids shown to people as part names. */
export const INPUT_LABELS: Record<string, string> = {
  rl1: 'RL1',
  rl2: 'RL2',
  rk: 'Rk',
  rt: 'Rt',
  rg1: 'RG1',
  rg2: 'RG2',
  rload1: 'Rload1',
  rload2: 'Rload2',
  rsource: 'Rsource',
  mu1: 'mu 1',
  mu2: 'mu 2',
  mu1Factor: 'mu 1',
  mu2Factor: 'mu 2',
  perv1: 'perveance 1',
  perv2: 'perveance 2',
};
