import { scaleBand, scaleLinear } from 'd3';
import type { Ref } from 'react';
import { formatSi } from '../format/formatSi.js';
import { Axis } from './Axis.js';
import { ChartSvg } from './ChartSvg.js';
import { DIM, MONO, SERIES_COLOURS } from './chartTheme.js';

export interface TornadoBar {
  label: string;
  /** Metric value with this input at its low / high extreme, the rest nominal. */
  low: number;
  high: number;
}

/**
 * Influence tornado: one bar per input spanning the metric's values at the input's low and high
 * extremes, centred on the nominal value, widest first.
 */
export function Tornado({
  bars,
  centre,
  unit,
  svgRef,
  label,
  width = 460,
}: {
  bars: TornadoBar[];
  centre: number;
  unit: string;
  svgRef?: Ref<SVGSVGElement>;
  label: string;
  width?: number;
}) {
  const sorted = bars
    .filter((b) => Number.isFinite(b.low) && Number.isFinite(b.high))
    .sort((a, b) => Math.abs(b.high - b.low) - Math.abs(a.high - a.low))
    .slice(0, 12);
  if (sorted.length === 0) return <p className="text-sm text-dim">No input moves this metric.</p>;
  const rowH = 20;
  const left = 96;
  const height = sorted.length * rowH + 44;
  const ends = sorted.flatMap((b) => [b.low, b.high]);
  // Without a nominal value (older results), centre the bars on the middle of their span.
  if (!Number.isFinite(centre)) centre = (Math.min(...ends) + Math.max(...ends)) / 2;
  const all = ends.concat(centre);
  const x = scaleLinear()
    .domain([Math.min(...all), Math.max(...all)])
    .range([left, width - 16])
    .nice();
  const y = scaleBand<string>()
    .domain(sorted.map((b) => b.label))
    .range([8, height - 36])
    .padding(0.22);
  return (
    <ChartSvg svgRef={svgRef} width={width} height={height} label={label}>
      {sorted.map((b) => {
        const yy = y(b.label) ?? 0;
        const seg = (v: number, colour: string, key: string) => {
          const a = x(Math.min(centre, v));
          const c = x(Math.max(centre, v));
          return (
            <rect key={key} x={a} width={Math.max(1, c - a)} y={yy} height={y.bandwidth()} fill={colour} />
          );
        };
        return (
          <g key={b.label}>
            <title>
              {b.label}: low → {formatSi(b.low, unit)}, high → {formatSi(b.high, unit)}
            </title>
            <text
              x={left - 6}
              y={yy + y.bandwidth() / 2}
              dy="0.32em"
              textAnchor="end"
              fontSize={11}
              fill={DIM}
              fontFamily={MONO}
            >
              {b.label}
            </text>
            {seg(b.low, SERIES_COLOURS[1], 'lo')}
            {seg(b.high, SERIES_COLOURS[0], 'hi')}
          </g>
        );
      })}
      <line x1={x(centre)} x2={x(centre)} y1={4} y2={height - 36} stroke={DIM} />
      <Axis scale={x} orient="bottom" at={height - 36} ticks={5} unit={unit} />
      <g fontSize={10} fill={DIM} transform={`translate(${left},${height - 8})`}>
        <rect width={9} height={9} y={-8} fill={SERIES_COLOURS[1]} />
        <text x={13}>input at low extreme</text>
        <rect x={130} width={9} height={9} y={-8} fill={SERIES_COLOURS[0]} />
        <text x={143}>at high extreme</text>
      </g>
    </ChartSvg>
  );
}
