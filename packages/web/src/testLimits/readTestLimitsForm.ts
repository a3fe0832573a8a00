import type { TestLimitsRequest } from '../api/lotsApi.js';

/** The guard band form as typed (text fields). */
export type TestLimitsForm = {
  source: 'given' | 'run';
  mean: string;
  sd: string;
  runId: string;
  metric: string;
  measurementSd: string;
  specLow: string;
  specHigh: string;
  testLow: string;
  testHigh: string;
  targetPpm: string;
  /** Save as the chosen test limits of the run's design (source 'run' only). */
  save?: boolean;
};

const num = (s: string) => (s.trim() === '' ? undefined : Number(s));

/**
 * Checks the form and builds the request, or returns one message per field (keys are the form's
 * field names). Mirrors the server's checks so most mistakes are caught before a round trip.
 *
 * @example readTestLimitsForm({ ...form, sd: '-1' }).errors // { sd: 'must be a positive number' }
 */
export function readTestLimitsForm(f: TestLimitsForm): {
  request?: TestLimitsRequest;
  errors: Record<string, string>;
} {
  const errors: Record<string, string> = {};
  const finite = (key: keyof TestLimitsForm, v: number | undefined, required: boolean) => {
    if (v === undefined) {
      if (required) errors[key] = 'required';
    } else if (!Number.isFinite(v)) errors[key] = 'must be a number';
    return v;
  };
  let process: TestLimitsRequest['process'] | undefined;
  if (f.source === 'given') {
    const mean = finite('mean', num(f.mean), true);
    const sd = finite('sd', num(f.sd), true);
    if (sd !== undefined && !errors.sd && !(sd > 0)) errors.sd = 'must be a positive number';
    if (mean !== undefined && sd !== undefined) process = { mean, sd };
  } else {
    if (!f.runId) errors.runId = 'choose a finished run';
    if (!f.metric) errors.metric = 'choose a metric';
    process = { runId: f.runId, metric: f.metric };
  }
  const measurementSd = finite('measurementSd', num(f.measurementSd), true);
  if (measurementSd !== undefined && !errors.measurementSd && measurementSd < 0) {
    errors.measurementSd = 'must be zero or positive';
  }
  const specLow = finite('specLow', num(f.specLow), false);
  const specHigh = finite('specHigh', num(f.specHigh), false);
  if (specLow === undefined && specHigh === undefined) errors.specLow = 'give a low or a high spec limit';
  if (specLow !== undefined && specHigh !== undefined && !(specLow < specHigh))
    errors.specHigh = 'must be above the low limit';
  const testLow = finite('testLow', num(f.testLow), false);
  const testHigh = finite('testHigh', num(f.testHigh), false);
  if (testLow !== undefined && testHigh !== undefined && !(testLow < testHigh))
    errors.testHigh = 'must be above the low limit';
  const target = finite('targetPpm', num(f.targetPpm), false);
  if (target !== undefined && !errors.targetPpm && !(target > 0 && target < 1e6)) {
    errors.targetPpm = 'must be between 0 and 1 000 000 PPM';
  }
  if (Object.keys(errors).length > 0 || !process || measurementSd === undefined) return { errors };
  const test = testLow === undefined && testHigh === undefined ? undefined : { low: testLow, high: testHigh };
  return {
    errors,
    request: {
      process,
      measurementSd,
      spec: { low: specLow, high: specHigh },
      ...(test ? { test } : {}),
      ...(target !== undefined ? { targetFalseAcceptPpm: target } : {}),
      ...(f.save && f.source === 'run' ? { save: true } : {}),
    },
  };
}

/** Server field paths (error.field) → the form field that shows the message. */
export const SERVER_FIELD: Record<string, keyof TestLimitsForm> = {
  'process.mean': 'mean',
  'process.sd': 'sd',
  'process.runId': 'runId',
  'process.metric': 'metric',
  process: 'sd',
  measurementSd: 'measurementSd',
  'spec.low': 'specLow',
  'spec.high': 'specHigh',
  'test.low': 'testLow',
  'test.high': 'testHigh',
  save: 'runId',
  targetFalseAcceptPpm: 'targetPpm',
};
