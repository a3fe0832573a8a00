import { scaleBand, scaleLinear } from 'd3';
import type { Ref } from 'react';
import { formatSig } from '../format/formatSi.js';
import { Axis } from './Axis.js';
import { DIM, FONT, MONO, SERIES_COLOURS } from './chartTheme.js';

export interface TornadoBar {
  label: string;
  /** Signed effect (e.g. a correlation or a standardised sensitivity); bars grow left or right of 0. */
  value: number;
}

/** Influence tornado: parts sorted by the size of their effect on one metric. */
export function Tornado({
  bars,
  svgRef,
  label,
  width = 460,
}: {
  bars: TornadoBar[];
  svgRef?: Ref<SVGSVGElement>;
  label: string;
  width?: number;
}) {
  const sorted = [...bars]
    .filter((b) => Number.isFinite(b.value))
    .sort((a, b) => Math.abs(b.value) - Math.abs(a.value));
  const rowH = 20;
  const left = 70;
  const height = sorted.length * rowH + 40;
  const m = Math.max(1e-12, ...sorted.map((b) => Math.abs(b.value)));
  const x = scaleLinear()
    .domain([-m, m])
    .range([left, width - 16])
    .nice();
  const y = scaleBand<string>()
    .domain(sorted.map((b) => b.label))
    .range([8, height - 32])
    .padding(0.2);
  return (
    <svg
      ref={svgRef}
      viewBox={`0 0 ${width} ${height}`}
      className="h-auto w-full"
      role="img"
      aria-label={label}
      fontFamily={FONT}
    >
      {sorted.map((b) => {
        const x0 = x(Math.min(0, b.value));
        const x1 = x(Math.max(0, b.value));
        return (
          <g key={b.label}>
            <text
              x={left - 6}
              y={(y(b.label) ?? 0) + y.bandwidth() / 2}
              dy="0.32em"
              textAnchor="end"
              fontSize={11}
              fill={DIM}
              fontFamily={MONO}
            >
              {b.label}
            </text>
            <rect
              x={x0}
              width={Math.max(1, x1 - x0)}
              y={y(b.label)}
              height={y.bandwidth()}
              fill={b.value >= 0 ? SERIES_COLOURS[0] : SERIES_COLOURS[1]}
            >
              <title>
                {b.label}: {formatSig(b.value)}
              </title>
            </rect>
          </g>
        );
      })}
      <line x1={x(0)} x2={x(0)} y1={4} y2={height - 32} stroke={DIM} />
      <Axis scale={x} orient="bottom" at={height - 32} ticks={5} />
    </svg>
  );
}
