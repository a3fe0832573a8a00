import { describe, expect, it } from 'vitest';
import { readTestLimitsForm, type TestLimitsForm } from './readTestLimitsForm.js';

const good: TestLimitsForm = {
  source: 'given',
  mean: '100',
  sd: '1',
  runId: '',
  metric: '',
  measurementSd: '0.3',
  specLow: '97.5',
  specHigh: '102.5',
  testLow: '',
  testHigh: '',
  targetPpm: '50',
};

describe('readTestLimitsForm', () => {
  it('builds the request from a good form', () => {
    expect(readTestLimitsForm(good).request).toEqual({
      process: { mean: 100, sd: 1 },
      measurementSd: 0.3,
      spec: { low: 97.5, high: 102.5 },
      targetFalseAcceptPpm: 50,
    });
  });

  it('names each bad field', () => {
    const { errors, request } = readTestLimitsForm({
      ...good,
      sd: '0',
      measurementSd: 'x',
      specLow: '3',
      specHigh: '1',
      targetPpm: '-4',
    });
    expect(request).toBeUndefined();
    expect(Object.keys(errors).sort()).toEqual(['measurementSd', 'sd', 'specHigh', 'targetPpm']);
    expect(readTestLimitsForm({ ...good, specLow: '', specHigh: '' }).errors.specLow).toMatch(
      /low or a high/,
    );
  });
});
