import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { MAX_SAMPLES, SAMPLING_PLANS } from '@sigmatail/engine';
import { useState } from 'react';
import { api } from '../api/client.js';
import { workspaceQueries } from '../api/queries/workspaceQueries.js';
import { authQueries } from '../api/queries/authQueries.js';
import type { SamplingPlan, Workspace } from '../api/types.js';
import { ErrorNote, QueryStatus } from '../components/QueryState.js';
import { ChoiceField } from '../components/ChoiceField.js';
import { TextField } from '../components/TextField.js';
import { Button, Panel } from '../components/ui.js';

/** Workspace name and the defaults new runs start from. */
export function WorkspacePanel() {
  const ws = useQuery(workspaceQueries.detail());
  return (
    <Panel title="Workspace settings">
      <QueryStatus query={ws} />
      {ws.data && <WorkspaceForm key={JSON.stringify(ws.data)} workspace={ws.data} />}
    </Panel>
  );
}

function WorkspaceForm({ workspace }: { workspace: Workspace }) {
  const qc = useQueryClient();
  const [name, setName] = useState(workspace.name);
  const [samples, setSamples] = useState(String(workspace.settings.defaultSamples));
  const [plan, setPlan] = useState<SamplingPlan>(workspace.settings.defaultPlan);
  const [target, setTarget] = useState(String(workspace.settings.defaultYieldTarget * 100));
  const save = useMutation({
    mutationFn: () =>
      api.admin.updateWorkspace({
        name,
        settings: {
          defaultSamples: Number(samples),
          defaultPlan: plan,
          defaultYieldTarget: Number(target) / 100,
        },
      }),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: workspaceQueries.all });
      await qc.invalidateQueries({ queryKey: authQueries.all });
    },
  });
  return (
    <form
      className="grid max-w-2xl gap-3 sm:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate();
      }}
    >
      <TextField
        id="ws-name"
        label="Workspace name"
        className="sm:col-span-2"
        required
        value={name}
        onChange={(e) => setName(e.target.value)}
      />
      <TextField
        id="ws-samples"
        label={<>Default samples per run (1 to {MAX_SAMPLES.toLocaleString('en-US')})</>}
        numeric
        inputMode="numeric"
        value={samples}
        onChange={(e) => setSamples(e.target.value)}
      />
      <ChoiceField
        id="ws-plan"
        label="Default sampling plan"
        value={plan}
        choices={SAMPLING_PLANS}
        onChange={setPlan}
      />
      <TextField
        id="ws-target"
        label="Yield target (%)"
        numeric
        inputMode="decimal"
        value={target}
        onChange={(e) => setTarget(e.target.value)}
      />
      <div className="sm:col-span-2">
        {save.isError && <ErrorNote error={save.error} />}
        {save.isSuccess && (
          <p role="status" className="mb-2 text-sm text-moss">
            Saved.
          </p>
        )}
        <Button tone="primary" type="submit" disabled={save.isPending}>
          Save settings
        </Button>
      </div>
    </form>
  );
}
