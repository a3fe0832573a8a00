import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../api/client.js';
import { runQueries } from '../api/queries/runQueries.js';
import { isFinished } from '../api/runStatus.js';
import type { RunView } from '../api/types.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { ErrorNote } from '../components/QueryState.js';
import { Button, Panel } from '../components/ui.js';
import { formatCount } from '../format/formatSi.js';

/**
 * Progress of a queued or running run. The page polls GET /api/runs/:id (see runQueries.detail),
 * so the bar picks up where it was after a reload.
 */
export function RunProgress({ run }: { run: RunView }) {
  const me = useMe();
  const qc = useQueryClient();
  const cancel = useMutation({
    mutationFn: () => api.runs.cancel(run.id),
    onSuccess: ({ run: r }) => qc.setQueryData(runQueries.detail(run.id).queryKey, r),
    onSettled: () => qc.invalidateQueries({ queryKey: runQueries.all }),
  });
  const pct = Math.round(run.progress.fraction * 1000) / 10;
  const active = !isFinished(run.status);
  return (
    <Panel title={active ? 'Running' : `Run ${run.status}`}>
      <div
        role="progressbar"
        aria-label="Run progress"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct}
        className="h-4 w-full overflow-hidden rounded-full bg-paper ring-1 ring-rule"
      >
        <div
          className={`h-full rounded-full transition-[width] duration-500 ${run.status === 'failed' ? 'bg-brick' : run.status === 'cancelled' ? 'bg-dim' : 'bg-glow'}`}
          style={{ width: `${pct}%` }}
        />
      </div>
      <p className="num mt-2 text-sm text-dim">
        {pct.toFixed(1)} % · {formatCount(run.progress.done)} of {formatCount(run.progress.total)} tasks ·{' '}
        {run.status === 'queued'
          ? 'waiting for a worker'
          : run.status === 'merging'
            ? 'merging chunk results'
            : run.status}
      </p>
      {run.error && <p className="mt-2 text-sm text-brick">{run.error}</p>}
      {active && (
        <div className="mt-3 flex items-center gap-3">
          <Button
            tone="danger"
            disabled={!can(me.role, 'launchRun') || cancel.isPending}
            title={can(me.role, 'launchRun') ? undefined : `Your role (${me.role}) cannot cancel runs`}
            onClick={() => cancel.mutate()}
          >
            {cancel.isPending ? 'Cancelling…' : 'Cancel run'}
          </Button>
          <span className="text-xs text-dim">You can leave this page; the run carries on.</span>
        </div>
      )}
      {cancel.isError && (
        <div className="mt-3">
          <ErrorNote error={cancel.error} />
        </div>
      )}
    </Panel>
  );
}
