import { describe, expect, it } from 'vitest';
import { ApiError } from '../api/client.js';
import { fieldError, namesField } from './fieldError.js';

describe('fieldError', () => {
  const err = new ApiError(400, 'strategies.1.within: must be a match window', 'strategies.1.within', [
    { path: 'strategies.1.within', message: 'must be a match window in percent (0 < x < 100)' },
  ]);

  it('finds the message for a field or any of its sub-fields', () => {
    expect(fieldError(err, 'strategies.1.within')).toBe('must be a match window in percent (0 < x < 100)');
    expect(fieldError(err, 'strategies')).toBe('must be a match window in percent (0 < x < 100)');
    expect(fieldError(err, 'samples')).toBeNull();
    expect(fieldError(new Error('x'), 'samples')).toBeNull();
  });

  it('falls back to the named field when there is no issue list (engine errors)', () => {
    const engine = new ApiError(400, 'samples: 1000 samples cannot show 5 PPM', 'samples');
    expect(fieldError(engine, 'samples')).toBe('samples: 1000 samples cannot show 5 PPM');
    expect(namesField(engine, ['designId', 'samples'])).toBe(true);
    expect(namesField(engine, ['designId'])).toBe(false);
  });
});
