import { useQuery } from '@tanstack/react-query';
import { useEffect, useMemo, useRef, type ReactNode } from 'react';
import { Link, useSearchParams } from 'react-router';
import { designQueries } from '../api/queries/designQueries.js';
import { runQueries } from '../api/queries/runQueries.js';
import { DISTORTION_OUTPUT_PEAK, latestDoneRun, splitterFigures } from '../choose/splitterFigures.js';
import { QueryStatus } from '../components/QueryState.js';
import { inputClass, PageTitle, Panel } from '../components/ui.js';
import { formatSi, formatSig } from '../format/formatSi.js';

const SLOTS = [
  { key: 'ltp', label: 'Long-tailed pair', fits: (t: string | null | undefined) => t !== 'split-load' },
  { key: 'split', label: 'Split-load', fits: (t: string | null | undefined) => t === 'split-load' || !t },
] as const;

/** One column of the comparison: a picked design's nominal figures and its latest finished run. */
function useColumn(id: string) {
  const design = useQuery({ ...designQueries.detail(id), enabled: id !== '' });
  const runs = useQuery({ ...runQueries.list({ designId: id, status: 'done' }), enabled: id !== '' });
  // The large-signal figures take tens of milliseconds: once per loaded design, not per render.
  const doc = design.data?.latestRevision.document;
  const figures = useMemo(() => (doc ? splitterFigures(doc) : null), [doc]);
  const run = runs.data ? latestDoneRun(runs.data) : null;
  const results = useQuery({ ...runQueries.results(run?.id ?? ''), enabled: run !== null });
  const balance = results.data?.results.metrics.balanceDb ?? null;
  return { design, figures, run, balance, runsLoaded: runs.isSuccess };
}

/** Two designs side by side (a long-tailed pair and a split-load), picked in the URL (?ltp=…&split=…). */
export function ChooseSplitterPage() {
  const [params, setParams] = useSearchParams();
  const ids = SLOTS.map((s) => params.get(s.key) ?? '');
  const list = useQuery(designQueries.list(''));
  const cols = [useColumn(ids[0]), useColumn(ids[1])];
  // Opened without a choice: start from the most recently changed design of each kind, so the
  // page shows a comparison at once (the list comes newest first). Only once per visit: a reader
  // who clears a slot keeps it cleared.
  const preset = useRef(false);
  useEffect(() => {
    if (preset.current || !list.data) return;
    preset.current = true;
    if (SLOTS.some((s) => params.has(s.key))) return;
    const next = new URLSearchParams(params);
    for (const s of SLOTS) {
      const first = list.data.find((d) => s.fits(d.topology));
      if (first) next.set(s.key, first.id);
    }
    setParams(next, { replace: true });
  }, [list.data, params, setParams]);
  const pick = (key: string, id: string) => {
    const next = new URLSearchParams(params);
    if (id) next.set(key, id);
    else next.delete(key);
    setParams(next, { replace: true });
  };
  const row = (label: string, cell: (c: (typeof cols)[number]) => ReactNode) => (
    <tr className="border-t border-rule">
      <th scope="row" className="py-1.5 pr-4 text-left font-normal text-dim">
        {label}
      </th>
      {cols.map((c, i) => (
        <td key={i} className="num pr-4">
          {c.figures ? cell(c) : '—'}
        </td>
      ))}
    </tr>
  );
  return (
    <div className="space-y-4">
      <PageTitle sub="Pick a long-tailed pair and a split-load design to set their nominal figures and yields side by side. High voltage: both stages run from a lethal B+.">
        Choose the splitter
      </PageTitle>
      <Panel title="Designs">
        <QueryStatus query={list} />
        <div className="grid gap-3 sm:grid-cols-2">
          {SLOTS.map((s, i) => (
            <div key={s.key} className="grid gap-1 text-sm text-dim">
              <label htmlFor={`choose-${s.key}`}>{s.label}</label>
              <select
                id={`choose-${s.key}`}
                className={inputClass}
                value={ids[i]}
                onChange={(e) => pick(s.key, e.target.value)}
              >
                <option value="">Pick a design…</option>
                {(list.data ?? [])
                  .filter((d) => d.id === ids[i] || s.fits(d.topology))
                  .map((d) => (
                    <option key={d.id} value={d.id}>
                      {d.name}
                    </option>
                  ))}
              </select>
            </div>
          ))}
        </div>
      </Panel>
      <Panel title="Side by side">
        <table className="w-full text-sm" aria-label="Splitter comparison">
          <thead>
            <tr className="text-left text-xs text-dim">
              <th className="font-normal" />
              {cols.map((c, i) => (
                <th key={i} className="font-medium text-ink">
                  {c.design.data ? (
                    <Link to={`/designs/${ids[i]}`}>{c.design.data.name}</Link>
                  ) : (
                    SLOTS[i].label
                  )}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {row('Topology', (c) => c.figures!.topology)}
            {row('Operating point', (c) => c.figures!.problem ?? 'ok')}
            {row('Gain to output 1 (plate)', (c) => formatSig(c.figures!.gain1))}
            {row('Gain to output 2 (plate 2 / cathode)', (c) => formatSig(c.figures!.gain2))}
            {row('Balance |A2|/|A1|', (c) => formatSi(c.figures!.balanceDb, 'dB'))}
            {row('Zout 1', (c) => formatSi(c.figures!.zout1, 'Ω'))}
            {row('Zout 2', (c) => formatSi(c.figures!.zout2, 'Ω'))}
            {row('Symmetrical swing, output 1 (peak, before grid current or cut-off)', (c) =>
              formatSi(c.figures!.swing1, 'V'),
            )}
            {row('Symmetrical swing, output 2 (peak)', (c) => formatSi(c.figures!.swing2, 'V'))}
            {row(`THD at ${DISTORTION_OUTPUT_PEAK} V peak on output 1: output 1 / output 2`, (c) =>
              Number.isFinite(c.figures!.thd1Percent) ? (
                <>
                  {formatSig(c.figures!.thd1Percent)} % / {formatSig(c.figures!.thd2Percent)} %
                  <span className="text-dim"> ({formatSi(c.figures!.drive, 'V')} peak drive)</span>
                </>
              ) : (
                'beyond the swing'
              ),
            )}
            {row('Balance spread (latest finished run): sd, 2.5–97.5 %', (c) =>
              c.balance && c.balance.sd !== null ? (
                <>
                  {formatSi(c.balance.sd, 'dB')}, {formatSi(c.balance.quantiles['p2.5'] ?? NaN, 'dB')} …{' '}
                  {formatSi(c.balance.quantiles['p97.5'] ?? NaN, 'dB')}
                </>
              ) : (
                '—'
              ),
            )}
            {row('Joint yield (latest finished run)', (c) =>
              c.run ? (
                <Link to={`/runs/${c.run.id}`}>
                  {formatSig(100 * c.run.summary!.jointYield!, 4)} % (rev {c.run.revision},{' '}
                  {c.run.samples.toLocaleString('en')} samples)
                </Link>
              ) : c.runsLoaded ? (
                'no finished run'
              ) : (
                '…'
              ),
            )}
          </tbody>
        </table>
      </Panel>
    </div>
  );
}
