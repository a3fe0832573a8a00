import { describe, expect, it } from 'vitest';
import { formatLogLine } from '../../scripts/formatLogLine.js';

describe('formatLogLine (npm start console)', () => {
  it('shortens a request record to method, path, status and time', () => {
    const line = JSON.stringify({
      level: 30,
      time: Date.UTC(2026, 11, 3, 9, 39, 25),
      pid: 1,
      hostname: 'vm',
      req: { id: 'x', method: 'GET', url: '/api/health', remoteAddress: '127.0.0.1' },
      res: { statusCode: 200 },
      responseTime: 26.4,
      msg: 'request completed',
    });
    expect(formatLogLine(line)).toBe('09:39:25 info  GET /api/health 200 26 ms');
  });

  it('keeps the message and the fields that name a run or chunk', () => {
    const line = JSON.stringify({
      level: 50,
      time: Date.UTC(2026, 11, 3, 10, 0, 0),
      msg: 'chunk failed',
      runId: 'r1',
      chunkIndex: 3,
      err: { type: 'Error', message: 'boom now' },
      other: 'hidden',
    });
    expect(formatLogLine(line)).toBe('10:00:00 ERROR chunk failed runId=r1 chunkIndex=3 err="boom now"');
  });

  it('passes plain text and JSON that is not a log record through unchanged', () => {
    expect(formatLogLine('sigmatail mail fake on smtp://127.0.0.1:2525')).toBe(
      'sigmatail mail fake on smtp://127.0.0.1:2525',
    );
    expect(formatLogLine('{"not":"a record"}')).toBe('{"not":"a record"}');
    expect(formatLogLine('{broken')).toBe('{broken');
  });
});
