import { describe, expect, it } from 'vitest';
import { ApiError } from '../api/client.js';
import { splitUploadError } from './splitUploadError.js';

describe('splitUploadError', () => {
  it('turns issue paths into row errors and the field message into a field note', () => {
    const err = new ApiError(400, 'file: the file has 2 problems; nothing was stored', 'file', [
      { path: 'rows.3.value', message: 'not a resistance: "x"' },
      { path: 'rows.1.', message: 'not readable as CSV' },
    ]);
    const s = splitUploadError(err);
    expect(s.rows).toEqual([
      { row: 3, column: 'value', message: 'not a resistance: "x"' },
      { row: 1, column: '', message: 'not readable as CSV' },
    ]);
    expect(s.fields).toEqual({ file: 'the file has 2 problems; nothing was stored' });
  });
});
