import {
  LARGE_SIGNAL_SUBSAMPLE,
  MAX_LARGE_SIGNAL_SAMPLES,
  MAX_SAMPLES,
  MAX_SEED_LENGTH,
  MIN_LARGE_SIGNAL_SAMPLES,
  SAMPLING_PLANS,
} from '@sigmatail/engine';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { workspaceQueries } from '../api/queries/workspaceQueries.js';
import { useState } from 'react';
import { useNavigate } from 'react-router';
import { api } from '../api/client.js';
import { runQueries } from '../api/queries/runQueries.js';
import type { SamplingPlan } from '../api/types.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { ChoiceField } from '../components/ChoiceField.js';
import { TextField } from '../components/TextField.js';
import { Button, Panel } from '../components/ui.js';

const PLAN_LABELS: Record<SamplingPlan, string> = {
  random: 'Random (Monte Carlo)',
  lhs: 'Latin hypercube',
  sobol: 'Sobol sequence',
};

/** Launch a run of the design's latest revision, starting from the workspace's default N and plan. */
export function RunLaunchPanel({ designId, revision }: { designId: string; revision?: number }) {
  const ws = useQuery(workspaceQueries.detail());
  if (ws.isPending) return <Loading />;
  const defaults = ws.data?.settings ?? { defaultSamples: 100_000, defaultPlan: 'random' as const };
  return (
    <RunLaunchForm
      designId={designId}
      revision={revision}
      samples={defaults.defaultSamples}
      plan={defaults.defaultPlan}
    />
  );
}

function RunLaunchForm(props: { designId: string; revision?: number; samples: number; plan: SamplingPlan }) {
  const { designId, revision } = props;
  const me = useMe();
  const qc = useQueryClient();
  const navigate = useNavigate();
  const allowed = can(me.role, 'launchRun');
  const [samples, setSamples] = useState(String(props.samples));
  const [seed, setSeed] = useState('');
  const [plan, setPlan] = useState<SamplingPlan>(props.plan);
  const [influence, setInfluence] = useState(true);
  const [worstCase, setWorstCase] = useState(true);
  const [varianceIndices, setVarianceIndices] = useState(false);
  const [largeSignal, setLargeSignal] = useState(false);
  const [lsSamples, setLsSamples] = useState(String(LARGE_SIGNAL_SUBSAMPLE));
  const n = Number(samples);
  const nError =
    !Number.isInteger(n) || n < 1 || n > MAX_SAMPLES
      ? `A whole number from 1 to ${MAX_SAMPLES.toLocaleString('en-US')}`
      : null;
  const m = Number(lsSamples);
  const lsError =
    largeSignal && (!Number.isInteger(m) || m < MIN_LARGE_SIGNAL_SAMPLES || m > MAX_LARGE_SIGNAL_SAMPLES)
      ? `A whole number from ${MIN_LARGE_SIGNAL_SAMPLES} to ${MAX_LARGE_SIGNAL_SAMPLES}`
      : null;
  const launch = useMutation({
    mutationFn: () =>
      api.runs.launch({
        designId,
        revision,
        samples: n,
        seed: seed.trim() || undefined,
        plan,
        analyses: {
          influence,
          worstCase,
          varianceIndices,
          largeSignal,
          ...(largeSignal ? { largeSignalSamples: m } : {}),
        },
      }),
    onSuccess: async ({ id }) => {
      await qc.invalidateQueries({ queryKey: runQueries.all });
      navigate(`/runs/${id}`);
    },
  });
  return (
    <Panel title="Launch a run">
      {!allowed && (
        <p className="mb-3 text-sm text-dim" role="note">
          Your role ({me.role}) cannot launch runs.
        </p>
      )}
      <form
        onSubmit={(e) => {
          e.preventDefault();
          if (!nError && !lsError) launch.mutate();
        }}
      >
        <fieldset disabled={!allowed} className="grid gap-3 sm:grid-cols-3">
          <TextField
            id="run-n"
            label="Samples N"
            numeric
            inputMode="numeric"
            value={samples}
            onChange={(e) => setSamples(e.target.value)}
            aria-invalid={!!nError}
            note={nError && <p className="mt-0.5 text-xs text-brick">{nError}</p>}
          />
          <TextField
            id="run-seed"
            label="Seed (blank = new)"
            numeric
            maxLength={MAX_SEED_LENGTH}
            value={seed}
            onChange={(e) => setSeed(e.target.value)}
          />
          <ChoiceField
            id="run-plan"
            label="Sampling plan"
            value={plan}
            choices={SAMPLING_PLANS}
            labelOf={(p) => PLAN_LABELS[p]}
            onChange={setPlan}
          />
          <div className="flex flex-wrap gap-4 text-sm sm:col-span-3">
            <label className="flex items-center gap-1.5">
              <input type="checkbox" checked={influence} onChange={(e) => setInfluence(e.target.checked)} />{' '}
              Influence
            </label>
            <label className="flex items-center gap-1.5">
              <input type="checkbox" checked={worstCase} onChange={(e) => setWorstCase(e.target.checked)} />{' '}
              Worst case
            </label>
            <label className="flex items-center gap-1.5">
              <input
                type="checkbox"
                checked={varianceIndices}
                onChange={(e) => setVarianceIndices(e.target.checked)}
              />{' '}
              Variance indices (Sobol, slower)
            </label>
            <label className="flex items-center gap-1.5">
              <input
                type="checkbox"
                checked={largeSignal}
                onChange={(e) => setLargeSignal(e.target.checked)}
              />{' '}
              Large-signal figures per sample (on a subsample, slower)
            </label>
            {largeSignal && (
              <label className="flex items-center gap-1.5">
                Subsample: first
                <input
                  id="run-ls-samples"
                  className="num w-16 rounded-md border border-rule bg-white px-1.5 py-0.5 text-sm"
                  inputMode="numeric"
                  value={lsSamples}
                  onChange={(e) => setLsSamples(e.target.value)}
                  aria-invalid={!!lsError}
                  aria-describedby={lsError ? 'run-ls-samples-error' : undefined}
                />
                samples
                {lsError && (
                  <span id="run-ls-samples-error" className="text-xs text-brick">
                    {lsError}
                  </span>
                )}
              </label>
            )}
          </div>
          <div className="sm:col-span-3">
            <Button
              tone="primary"
              type="submit"
              disabled={!allowed || launch.isPending || !!nError || !!lsError}
            >
              {launch.isPending ? 'Launching…' : 'Launch run'}
            </Button>
          </div>
        </fieldset>
      </form>
      {launch.isError && (
        <div className="mt-3">
          <ErrorNote error={launch.error} />
        </div>
      )}
    </Panel>
  );
}
