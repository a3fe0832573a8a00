import { scaleBand, scaleLinear } from 'd3';
import type { Ref } from 'react';
import { Axis } from './Axis.js';
import { ChartSvg } from './ChartSvg.js';
import { DIM, INK, MARGIN, SERIES_COLOURS } from './chartTheme.js';

/** One bar: a strategy's label, value and optional interval (same unit). */
export interface Bar {
  label: string;
  value: number;
  low?: number;
  high?: number;
}

/**
 * Horizontal bars, one per strategy, with an interval whisker where given; the value is printed
 * at the end of each bar with `format`.
 */
export function PairingBars({
  bars,
  unit,
  format,
  colour = SERIES_COLOURS[0],
  svgRef,
  width = 460,
}: {
  bars: Bar[];
  unit: string;
  format: (v: number) => string;
  colour?: string;
  svgRef?: Ref<SVGSVGElement>;
  width?: number;
}) {
  const left = 170;
  const height = MARGIN.top + MARGIN.bottom + bars.length * 34;
  const max = Math.max(
    ...bars.map((b) => (Number.isFinite(b.high) ? b.high! : b.value)).filter(Number.isFinite),
    1e-9,
  );
  const x = scaleLinear()
    .domain([0, max * 1.15])
    .range([left, width - MARGIN.right - 40])
    .nice();
  const y = scaleBand()
    .domain(bars.map((_b, i) => String(i)))
    .range([MARGIN.top, height - MARGIN.bottom])
    .padding(0.3);
  return (
    <ChartSvg svgRef={svgRef} width={width} height={height} label={`Pairing strategies: ${unit}`}>
      <Axis scale={x} orient="bottom" at={height - MARGIN.bottom} ticks={4} />
      <text x={(left + width) / 2} y={height - 6} textAnchor="middle" fontSize={10} fill={DIM}>
        {unit}
      </text>
      {bars.map((b, i) => {
        const top = y(String(i))!;
        const h = y.bandwidth();
        const v = Number.isFinite(b.value) ? b.value : 0;
        return (
          <g key={i}>
            <text x={left - 8} y={top + h / 2} dy="0.32em" textAnchor="end" fontSize={11} fill={INK}>
              {b.label}
            </text>
            <rect
              x={left}
              y={top}
              width={Math.max(0, x(v) - left)}
              height={h}
              fill={colour}
              fillOpacity={0.8}
            />
            {b.low !== undefined && b.high !== undefined && (
              <g stroke={INK}>
                <line x1={x(b.low)} x2={x(b.high)} y1={top + h / 2} y2={top + h / 2} />
                <line x1={x(b.low)} x2={x(b.low)} y1={top + 3} y2={top + h - 3} />
                <line x1={x(b.high)} x2={x(b.high)} y1={top + 3} y2={top + h - 3} />
              </g>
            )}
            <text x={x(Math.max(v, b.high ?? v)) + 6} y={top + h / 2} dy="0.32em" fontSize={10} fill={DIM}>
              {format(b.value)}
            </text>
          </g>
        );
      })}
    </ChartSvg>
  );
}
