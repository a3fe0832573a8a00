import type { RunStatus } from './types.js';

/** True once a run can make no more progress (done, failed or cancelled). */
export function isFinished(status: RunStatus): boolean {
  return status === 'done' || status === 'failed' || status === 'cancelled';
}
