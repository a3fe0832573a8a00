import { CORNER_METRICS, describeMetric, METRICS, type MetricInfo } from '@sigmatail/engine';

/**
 * Label and unit of a metric id, including frequency columns ('acBalanceDb@20000' → 'Balance at
 * 20 kHz'); unknown ids show as themselves without a unit.
 */
export function metricInfo(id: string): Pick<MetricInfo, 'label' | 'unit' | 'description'> {
  return describeMetric(id);
}

/** Metrics worth plotting (the bias-point flag is not); frequency columns come from the specs. */
export const PLOTTABLE = [...METRICS.filter((m) => m.id !== 'valid'), ...CORNER_METRICS].map(
  (m) => m.id as string,
);

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
  cin: 'Cin',
  cg2: 'Cg2',
  cout1: 'Cout1',
  cout2: 'Cout2',
  cstray1: 'Cstray1',
  cstray2: 'Cstray2',
  mu1: 'mu 1',
  mu2: 'mu 2',
  mu1Factor: 'mu 1',
  mu2Factor: 'mu 2',
  perv1: 'perveance 1',
  perv2: 'perveance 2',
};
