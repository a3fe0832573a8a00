import { Link } from 'react-router';
import type { RunView } from '../api/types.js';
import { formatCount } from '../format/formatSi.js';
import { formatWhen } from '../format/formatWhen.js';
import { RunStatusBadge } from './RunStatusBadge.js';

/** What a run is: design revision, N, seed, plan, engine version — everything needed to repeat it. */
export function RunHeader({ run }: { run: RunView }) {
  return (
    <div className="mb-4">
      <h1 className="flex flex-wrap items-center gap-3 text-2xl font-semibold tracking-tight">
        Run <span className="num text-xl">{run.id.slice(0, 8)}</span> <RunStatusBadge status={run.status} />
      </h1>
      <p className="mt-1 text-sm text-dim">
        <Link to={`/designs/${run.designId}`} className="text-glow underline">
          {run.designName}
        </Link>{' '}
        · <span className="num">rev {run.revision}</span> ·{' '}
        <span className="num">N = {formatCount(run.samples)}</span> · plan {run.plan} · seed{' '}
        <span className="num">{run.seed}</span> · engine <span className="num">{run.engineVersion}</span> · by{' '}
        {run.createdBy.name}, {formatWhen(run.createdAt)}
      </p>
    </div>
  );
}
