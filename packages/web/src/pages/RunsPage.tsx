import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { runQueries } from '../api/queries/runQueries.js';
import { QueryStatus } from '../components/QueryState.js';
import { PageTitle, Panel } from '../components/ui.js';
import { CompareLink } from '../runs/CompareLink.js';
import { RunTable } from '../runs/RunTable.js';
import { togglePick } from '../runs/togglePick.js';

export function RunsPage() {
  const runs = useQuery(runQueries.list());
  const [picked, setPicked] = useState<string[]>([]);
  return (
    <div>
      <PageTitle sub="Every run in the workspace. Runs are reproducible: same design, N, seed and plan give the same numbers.">
        Runs
      </PageTitle>
      <Panel actions={<CompareLink picked={picked} />}>
        <QueryStatus query={runs} label="Loading runs…" />
        {runs.data && (
          <RunTable
            runs={runs.data}
            picked={picked}
            onPick={(id, on) => setPicked((p) => togglePick(p, id, on))}
          />
        )}
      </Panel>
    </div>
  );
}
