import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '../api/client.js';
import { adminQueries } from '../api/queries/adminQueries.js';
import { authQueries } from '../api/queries/authQueries.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { Button, inputClass, labelClass, Panel } from '../components/ui.js';

export function WorkspacePanel() {
  const qc = useQueryClient();
  const ws = useQuery(adminQueries.workspace());
  const [name, setName] = useState<string | null>(null);
  const save = useMutation({
    mutationFn: (patch: { name: string }) => api.admin.updateWorkspace(patch),
    onSuccess: async () => {
      setName(null);
      await qc.invalidateQueries({ queryKey: adminQueries.all });
      await qc.invalidateQueries({ queryKey: authQueries.all });
    },
  });
  return (
    <Panel title="Workspace settings">
      {ws.isPending && <Loading />}
      {ws.isError && <ErrorNote error={ws.error} onRetry={() => ws.refetch()} />}
      {ws.data && (
        <form
          className="max-w-lg space-y-3"
          onSubmit={(e) => {
            e.preventDefault();
            save.mutate({ name: name ?? ws.data.name });
          }}
        >
          <div>
            <label htmlFor="ws-name" className={labelClass}>
              Workspace name
            </label>
            <input
              id="ws-name"
              className={inputClass}
              value={name ?? ws.data.name}
              onChange={(e) => setName(e.target.value)}
            />
          </div>
          {ws.data.settings && Object.keys(ws.data.settings).length > 0 && (
            <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm">
              {Object.entries(ws.data.settings).map(([k, v]) => (
                <div key={k} className="contents">
                  <dt className="text-dim">{k}</dt>
                  <dd className="num">{typeof v === 'object' ? JSON.stringify(v) : String(v)}</dd>
                </div>
              ))}
            </dl>
          )}
          {save.isError && <ErrorNote error={save.error} />}
          {save.isSuccess && (
            <p role="status" className="text-sm text-moss">
              Saved.
            </p>
          )}
          <Button tone="primary" type="submit" disabled={save.isPending || name === null}>
            Save
          </Button>
        </form>
      )}
    </Panel>
  );
}
