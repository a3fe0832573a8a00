import type { ScaleLinear } from 'd3';
import { formatSi } from '../format/formatSi.js';
import { DIM, GRID, MONO } from './chartTheme.js';

interface AxisProps {
  scale: ScaleLinear<number, number>;
  orient: 'bottom' | 'left';
  /** Where the axis line sits: y for a bottom axis, x for a left axis (pixels). */
  at: number;
  /** Length of grid lines across the plot (0 for none). */
  grid?: number;
  unit?: string;
  ticks?: number;
}

/** A numeric axis drawn from a d3 scale's ticks, labels in the mono face with SI prefixes. */
export function Axis({ scale, orient, at, grid = 0, unit = '', ticks = 6 }: AxisProps) {
  const values = scale.ticks(ticks);
  const [r0, r1] = scale.range();
  const labels = distinctLabels(values, unit === 'dB' || unit === '%' ? '' : unit);
  return (
    <g fontFamily={MONO} fontSize={10} fill={DIM}>
      {orient === 'bottom' ? (
        <line x1={r0} x2={r1} y1={at} y2={at} stroke={DIM} />
      ) : (
        <line y1={r0} y2={r1} x1={at} x2={at} stroke={DIM} />
      )}
      {values.map((v, i) => {
        const p = scale(v);
        const label = labels[i];
        return orient === 'bottom' ? (
          <g key={v} transform={`translate(${p},0)`}>
            {grid > 0 && <line y1={at} y2={at - grid} stroke={GRID} />}
            <line y1={at} y2={at + 4} stroke={DIM} />
            <text y={at + 15} textAnchor="middle">
              {label}
            </text>
          </g>
        ) : (
          <g key={v} transform={`translate(0,${p})`}>
            {grid > 0 && <line x1={at} x2={at + grid} stroke={GRID} />}
            <line x1={at} x2={at - 4} stroke={DIM} />
            <text x={at - 7} dy="0.32em" textAnchor="end">
              {label}
            </text>
          </g>
        );
      })}
    </g>
  );
}

/** Tick labels with the fewest significant figures (3 at least) that keep neighbouring ticks apart. */
function distinctLabels(values: number[], unit: string): string[] {
  for (let digits = 3; ; digits++) {
    const labels = values.map((v) => formatSi(v, unit, digits).replace(/ $/, ''));
    if (digits >= 8 || new Set(labels).size === labels.length) return labels;
  }
}
