import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { runQueries } from '../api/queries/runQueries.js';
import { QueryStatus } from '../components/QueryState.js';
import { Panel } from '../components/ui.js';
import { CompareLink } from './CompareLink.js';
import { RunTable } from './RunTable.js';
import { togglePick } from './togglePick.js';

/** Runs of one design, with a shortcut to compare the picked ones. */
export function DesignRunsPanel({ designId }: { designId: string }) {
  const runs = useQuery(runQueries.list({ designId }));
  const [picked, setPicked] = useState<string[]>([]);
  return (
    <Panel title="Runs of this design" actions={<CompareLink picked={picked} />}>
      <QueryStatus query={runs} />
      {runs.data && (
        <RunTable
          runs={runs.data}
          showDesign={false}
          picked={picked}
          onPick={(id, on) => setPicked((p) => togglePick(p, id, on))}
        />
      )}
    </Panel>
  );
}
