import { line, scaleLinear } from 'd3';
import type { Ref } from 'react';
import { Axis } from './Axis.js';
import { ChartSvg } from './ChartSvg.js';
import { DIM, MARGIN, SERIES_COLOURS, SPEC } from './chartTheme.js';

const LIMIT = '#8a6414';

/**
 * The true (process) and measured distributions of one quantity with the spec limits (dashed) and
 * the test limits (solid): what the guard band calculator computes, drawn.
 */
export function GuardBandChart({
  mean,
  sd,
  measurementSd,
  spec,
  test,
  svgRef,
  width = 560,
  height = 220,
}: {
  mean: number;
  sd: number;
  measurementSd: number;
  spec: { low?: number; high?: number };
  test: { low?: number; high?: number };
  svgRef?: Ref<SVGSVGElement>;
  width?: number;
  height?: number;
}) {
  const total = Math.hypot(sd, measurementSd);
  const marks = [spec.low, spec.high, test.low, test.high].filter((v): v is number => v !== undefined);
  const lo = Math.min(mean - 4.5 * total, ...marks);
  const hi = Math.max(mean + 4.5 * total, ...marks);
  const x = scaleLinear()
    .domain([lo, hi])
    .range([MARGIN.left, width - MARGIN.right])
    .nice();
  const pdf = (v: number, s: number) => Math.exp(-0.5 * ((v - mean) / s) ** 2) / (s * Math.sqrt(2 * Math.PI));
  const y = scaleLinear()
    .domain([0, pdf(mean, sd) * 1.1])
    .range([height - MARGIN.bottom, MARGIN.top]);
  const xs = Array.from({ length: 201 }, (_, i) => lo + ((hi - lo) * i) / 200);
  const path = (s: number) =>
    line<number>()
      .x((v) => x(v))
      .y((v) => y(pdf(v, s)))(xs) ?? '';
  const base = y(0);
  const vline = (
    v: number | undefined,
    colour: string,
    dash: string | undefined,
    text: string,
    key: string,
  ) =>
    v === undefined ? null : (
      <g key={key}>
        <line
          x1={x(v)}
          x2={x(v)}
          y1={MARGIN.top}
          y2={base}
          stroke={colour}
          strokeWidth={1.6}
          strokeDasharray={dash}
        />
        <text x={x(v) + 3} y={MARGIN.top + (key.startsWith('t') ? 22 : 8)} fontSize={10} fill={colour}>
          {text}
        </text>
      </g>
    );
  return (
    <ChartSvg svgRef={svgRef} width={width} height={height} label="Process, measurement and limits">
      <path
        d={path(sd)}
        fill={SERIES_COLOURS[0]}
        fillOpacity={0.12}
        stroke={SERIES_COLOURS[0]}
        strokeWidth={1.8}
      />
      {measurementSd > 0 && (
        <path
          d={path(total)}
          fill="none"
          stroke={SERIES_COLOURS[1]}
          strokeWidth={1.5}
          strokeDasharray="5 3"
        />
      )}
      {vline(spec.low, SPEC, '5 3', 'spec', 'sl')}
      {vline(spec.high, SPEC, '5 3', 'spec', 'sh')}
      {vline(test.low, LIMIT, undefined, 'test', 'tl')}
      {vline(test.high, LIMIT, undefined, 'test', 'th')}
      <Axis scale={x} orient="bottom" at={base} ticks={6} />
      <text x={MARGIN.left} y={height - 6} fontSize={10} fill={DIM}>
        solid: true values · dashed: as measured
      </text>
    </ChartSvg>
  );
}
