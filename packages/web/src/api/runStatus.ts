import type { RunStatus } from './types.js';

/** True once a run can make no more progress (done, failed or cancelled). */
export function isFinished(status: RunStatus | string): boolean {
  return ['done', 'completed', 'succeeded', 'failed', 'cancelled', 'canceled'].includes(status);
}

/** True when the run finished with results to read. */
export function hasResults(status: RunStatus | string): boolean {
  return ['done', 'completed', 'succeeded'].includes(status);
}
