import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { MetricSummary, RunResults } from '@sigmatail/engine';
import { BalanceBandPanel } from './BalanceBandPanel.js';

const summary = (p50: number): MetricSummary => ({
  ...{ count: 100, mean: p50, sd: 0.1, min: p50 - 1, max: p50 + 1, quantileMaxError: 0.001 },
  quantiles: { 'p0.135': p50 - 0.5, 'p2.5': p50 - 0.3, p50, 'p97.5': p50 + 0.3, 'p99.865': p50 + 0.5 },
  histogram: { edges: [], counts: [], underflow: 0, overflow: 0 },
});
const run = (metrics: Record<string, MetricSummary>) => ({ metrics, nominal: {} }) as unknown as RunResults;

describe('BalanceBandPanel', () => {
  it('draws the band when the run has the balance columns', () => {
    render(
      <BalanceBandPanel
        runId="abcdef12"
        results={run({
          'acBalanceDb@20': summary(0.4),
          'acBalanceDb@1000': summary(0.2),
          'acBalanceDb@20000': summary(0.1),
        })}
      />,
    );
    expect(screen.getByRole('img', { name: /Balance median and 95 % envelope/ })).toBeInTheDocument();
    expect(screen.getByText(/at 3 frequencies/)).toBeInTheDocument();
  });

  it('draws nothing for a run stored before the band existed', () => {
    const { container } = render(
      <BalanceBandPanel runId="abcdef12" results={run({ balanceDb: summary(0.2) })} />,
    );
    expect(container).toBeEmptyDOMElement();
  });
});
