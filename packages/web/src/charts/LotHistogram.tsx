import { line, scaleLinear } from 'd3';
import type { Ref } from 'react';
import { Axis } from './Axis.js';
import { ChartSvg } from './ChartSvg.js';
import { ValueAxis } from './ValueAxis.js';
import { DIM, MARGIN, SERIES_COLOURS, SPEC } from './chartTheme.js';

/** A fitted curve drawn over the bars: its probability density (per unit of x). */
export interface FittedCurve {
  label: string;
  density: (x: number) => number;
}

const CURVE_COLOURS = [SERIES_COLOURS[1], SERIES_COLOURS[2]] as const;

/**
 * Histogram of a measured lot (count per bin) with fitted densities drawn as expected counts per
 * bin (density × bin width × n), so a good fit runs along the bar tops. Used by the lot page.
 */
export function LotHistogram({
  lo,
  binWidth,
  counts,
  curves,
  unit,
  label,
  svgRef,
  width = 560,
  height = 240,
}: {
  lo: number;
  /** Bin width, in the unit of x. */
  binWidth: number;
  counts: number[];
  curves: FittedCurve[];
  unit: string;
  label: string;
  svgRef?: Ref<SVGSVGElement>;
  width?: number;
  height?: number;
}) {
  const n = counts.reduce((a, b) => a + b, 0);
  const hi = lo + binWidth * counts.length;
  const pad = (hi - lo) * 0.04 || 1;
  const x = scaleLinear()
    .domain([lo - pad, hi + pad])
    .range([MARGIN.left, width - MARGIN.right]);
  const xs = Array.from({ length: 161 }, (_, i) => lo - pad + ((hi - lo + 2 * pad) * i) / 160);
  const curveYs = curves.map((c) => xs.map((v) => c.density(v) * binWidth * n));
  const top = Math.max(1, ...counts, ...curveYs.flat().filter(Number.isFinite));
  const y = scaleLinear()
    .domain([0, top * 1.08])
    .range([height - MARGIN.bottom, MARGIN.top])
    .nice();
  const base = y(0);
  const path = line<number>()
    .x((_, i) => x(xs[i]!))
    .y((v) => y(Math.min(v, top * 1.08)));
  return (
    <ChartSvg svgRef={svgRef} width={width} height={height} label={label}>
      <ValueAxis scale={y} width={width} unit="" ticks={4} />
      <g fill={SERIES_COLOURS[0]} fillOpacity={0.78}>
        {counts.map((c, i) => {
          const x0 = x(lo + i * binWidth);
          const x1 = x(lo + (i + 1) * binWidth);
          return (
            <rect key={i} x={x0 + 0.5} width={Math.max(0.5, x1 - x0 - 1)} y={y(c)} height={base - y(c)} />
          );
        })}
      </g>
      {curveYs.map((ys, ci) => (
        <path
          key={ci}
          d={path(ys) ?? ''}
          fill="none"
          stroke={CURVE_COLOURS[ci % 2]}
          strokeWidth={1.8}
          strokeDasharray={ci === 1 ? '6 3' : undefined}
        />
      ))}
      <Axis scale={x} orient="bottom" at={base} unit={unit} ticks={6} />
      <text x={MARGIN.left} y={height - 6} fontSize={10} fill={DIM}>
        parts per bin
      </text>
      {curves.map((c, ci) => (
        <g
          key={c.label}
          transform={`translate(${width - MARGIN.right - (curves.length - ci) * 96},${height - 15})`}
        >
          <line
            x1={0}
            x2={14}
            y1={5}
            y2={5}
            stroke={CURVE_COLOURS[ci % 2]}
            strokeWidth={2}
            strokeDasharray={ci === 1 ? '6 3' : undefined}
          />
          <text x={18} y={9} fontSize={10} fill={c.label ? DIM : SPEC}>
            {c.label}
          </text>
        </g>
      ))}
    </ChartSvg>
  );
}
