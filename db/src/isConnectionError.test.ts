import { describe, expect, it } from 'vitest';
import { isConnectionError } from './isConnectionError.js';

describe('isConnectionError', () => {
  it('knows outages by SQLSTATE, socket code or message', () => {
    const withCode = (code: string) => Object.assign(new Error('x'), { code });
    expect(isConnectionError(withCode('57P01'))).toBe(true);
    expect(isConnectionError(withCode('ECONNREFUSED'))).toBe(true);
    expect(isConnectionError(new Error('Connection terminated unexpectedly'))).toBe(true);
    expect(isConnectionError(new Error('connect ECONNREFUSED 127.0.0.1:55432'))).toBe(true);
  });

  it('leaves statement errors alone', () => {
    expect(isConnectionError(Object.assign(new Error('duplicate key'), { code: '23505' }))).toBe(false);
    expect(isConnectionError(new Error('chunk 3 of 9 is not stored'))).toBe(false);
    expect(isConnectionError('ECONNREFUSED')).toBe(false);
  });
});
