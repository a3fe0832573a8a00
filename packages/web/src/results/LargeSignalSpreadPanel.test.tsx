import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { LargeSignalSpread, LargeSignalSummary, RunResults } from '@sigmatail/engine';
import { CompareLargeSignal } from '../compare/CompareLargeSignal.js';
import { LargeSignalSpreadPanel } from './LargeSignalSpreadPanel.js';

const s = (mean: number): LargeSignalSummary => ({
  count: 32,
  mean,
  interval: [mean * 0.95, mean * 1.05],
  min: mean * 0.8,
  max: mean * 1.2,
});
const spread: LargeSignalSpread = {
  subsample: 32,
  drive: 1.25,
  driveSymmetric: s(2.5),
  swing1: s(61),
  swing2: s(58),
  thd1Percent: s(1.2),
  thd2Percent: s(1.4),
  h2Percent1: s(1.1),
  h3Percent1: s(0.3),
  h2Percent2: s(1.3),
  h3Percent2: s(0.35),
};
const run = (largeSignal?: Partial<LargeSignalSpread>) =>
  ({ samples: 4000, largeSignal }) as unknown as RunResults;

describe('LargeSignalSpreadPanel', () => {
  it('states the subsample and the drive, and each figure as mean, interval and min–max', () => {
    render(<LargeSignalSpreadPanel results={run(spread)} />);
    expect(screen.getByText(/subsample estimate/)).toBeInTheDocument();
    expect(screen.getByTestId('large-signal-subsample')).toHaveTextContent('32');
    expect(screen.getByTestId('large-signal-drive')).toHaveTextContent('1.25 V peak');
    const thd = within(screen.getByTestId('large-signal-thd1'));
    expect(thd.getByText('1.2 %')).toBeInTheDocument();
    expect(thd.getByText('1.14 – 1.26 %')).toBeInTheDocument();
    expect(thd.getByText('0.96 %')).toBeInTheDocument();
    expect(within(screen.getByTestId('large-signal-swing2')).getByText('58 V')).toBeInTheDocument();
    expect(screen.getByTestId('large-signal-h32')).toHaveTextContent('0.35 %');
  });

  it('says "not computed" for a run without them, and skips figures an older run lacks', () => {
    const { unmount } = render(<LargeSignalSpreadPanel results={run()} />);
    expect(screen.getByTestId('large-signal-spread-absent')).toHaveTextContent(/Not computed/);
    unmount();
    const { h2Percent2: _h2, h3Percent2: _h3, ...older } = spread;
    render(<LargeSignalSpreadPanel results={run(older)} />);
    expect(screen.getByTestId('large-signal-thd2')).toBeInTheDocument();
    expect(screen.queryByTestId('large-signal-h22')).toBeNull();
  });
});

describe('CompareLargeSignal', () => {
  it('shows each run’s means with the difference from A, and "not computed" for a run without', () => {
    render(<CompareLargeSignal results={[run(spread), run({ ...spread, thd1Percent: s(1.5) }), run()]} />);
    const table = within(screen.getByTestId('compare-large-signal'));
    const thdRow = table.getByRole('row', { name: /THD, out 1/ });
    expect(thdRow).toHaveTextContent('(+0.3 %)');
    expect(within(thdRow).getByText('not computed')).toBeInTheDocument();
  });

  it('says so once when no run has them', () => {
    render(<CompareLargeSignal results={[run(), run()]} />);
    expect(screen.getByTestId('compare-large-signal-absent')).toBeInTheDocument();
  });
});
