import { useMemo } from 'react';
import { largeSignalReport, type DriveLimit, type ResolvedDesign } from '@sigmatail/engine';
import { formatSi, formatSig } from '../format/formatSi.js';

const LIMIT_TEXT: Record<DriveLimit, string> = {
  'grid-current-1': 'grid current, section 1',
  'grid-current-2': 'grid current, section 2',
  'cut-off-1': 'cut-off, section 1',
  'cut-off-2': 'cut-off, section 2',
  none: 'no limit found',
};

/**
 * Nominal large-signal figures from the triode model, recomputed by the engine in the browser:
 * the drive range before grid current or cut-off, the symmetrical swing at each output (both
 * plates; the plate and the cathode of a split-load), and the distortion of each output at half
 * the symmetrical drive limit.
 */
export function LargeSignalPanel({ design }: { design: ResolvedDesign }) {
  const r = useMemo(() => largeSignalReport(design), [design]);
  if (r.status !== 'ok') return null;
  const splitLoad = design.topology === 'split-load';
  const outputs = splitLoad ? 'plate / cathode' : 'plate 1 / 2';
  const [out1, out2] = splitLoad ? ['plate', 'cathode'] : ['out 1', 'out 2'];
  const row = (label: string, value: string) => (
    <div className="flex items-baseline justify-between gap-3 py-0.5">
      <dt className="text-sm text-dim">{label}</dt>
      <dd className="num text-sm">{value}</dd>
    </div>
  );
  const pct = (x: number | undefined) => (x === undefined ? '—' : `${formatSig(x)} %`);
  return (
    <div aria-label="Large signal">
      <h3 className="mb-1 text-xs font-semibold text-ink">Large signal (nominal, quasi-static)</h3>
      <dl data-testid="large-signal">
        {row('Drive limit, grid 1 (+)', `${formatSi(r.drivePositive, 'V')} · ${LIMIT_TEXT[r.limitPositive]}`)}
        {row('Drive limit, grid 1 (−)', `${formatSi(r.driveNegative, 'V')} · ${LIMIT_TEXT[r.limitNegative]}`)}
        {row(`Symmetrical swing, ${outputs}`, `${formatSi(r.swing1, 'V')} / ${formatSi(r.swing2, 'V')} peak`)}
        {row('Distortion at', `${formatSi(r.drive, 'V')} peak drive`)}
        {row(`THD ${out1} / ${out2}`, `${pct(r.out1?.thdPercent)} / ${pct(r.out2?.thdPercent)}`)}
        {row(`H2 · H3, ${out1}`, `${pct(r.out1?.h2Percent)} · ${pct(r.out1?.h3Percent)}`)}
        {row(`H2 · H3, ${out2}`, `${pct(r.out2?.h2Percent)} · ${pct(r.out2?.h3Percent)}`)}
      </dl>
    </div>
  );
}
