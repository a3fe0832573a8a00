import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { FrontierChart } from './FrontierChart.js';

describe('FrontierChart', () => {
  it('draws one dot per plan, rings the chosen one and marks the target and the confirming run', () => {
    const { container } = render(
      <FrontierChart
        currency="EUR"
        targetPpm={500}
        points={[
          { cost: 16.74, rejectPpm: 750, lowPpm: 455, highPpm: 1237 },
          { cost: 16.76, rejectPpm: 100, lowPpm: 27, highPpm: 365, chosen: true },
          { cost: 16.78, rejectPpm: 0, lowPpm: 0, highPpm: 192 },
        ]}
        confirm={{ cost: 16.76, rejectPpm: 30, lowPpm: 10, highPpm: 88 }}
      />,
    );
    expect(screen.getByRole('img', { name: 'Cost per unit against reject rate' })).toBeInTheDocument();
    expect(container.querySelectorAll('circle[r="3.5"]')).toHaveLength(3);
    expect(container.querySelectorAll('circle[r="8"]')).toHaveLength(1);
    expect(screen.getByText('target 500 PPM')).toBeInTheDocument();
    expect(screen.getByText('confirming run')).toBeInTheDocument();
    // A zero reject rate sits on the axis floor, not at -Infinity.
    for (const c of container.querySelectorAll('circle'))
      expect(Number(c.getAttribute('cy'))).toBeLessThan(300);
  });

  it('says so when there is no plan', () => {
    render(<FrontierChart currency="EUR" targetPpm={500} points={[]} />);
    expect(screen.getByText('No plan on the frontier.')).toBeInTheDocument();
  });
});
