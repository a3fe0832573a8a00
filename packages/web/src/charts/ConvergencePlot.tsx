import { scaleLinear, scaleLog } from 'd3';
import type { Ref } from 'react';
import { ChartSvg } from './ChartSvg.js';
import { ValueAxis } from './ValueAxis.js';
import { DIM, MARGIN, MONO, SERIES_COLOURS } from './chartTheme.js';

export interface ConvergencePoint {
  n: number;
  value: number;
  lo?: number;
  hi?: number;
}

/** Running estimate (e.g. yield) against samples drawn, on a log sample axis, with its interval band. */
export function ConvergencePlot({
  points,
  label,
  svgRef,
  width = 460,
  height = 220,
  percent = true,
}: {
  points: ConvergencePoint[];
  label: string;
  svgRef?: Ref<SVGSVGElement>;
  width?: number;
  height?: number;
  percent?: boolean;
}) {
  const pts = points.filter((p) => p.n > 0 && Number.isFinite(p.value));
  if (pts.length < 2)
    return (
      <p className="text-sm text-dim">
        The run finished in one step, so there is no trace to plot; larger runs show one.
      </p>
    );
  const k = percent ? 100 : 1;
  const x = scaleLog()
    .domain([pts[0].n, pts[pts.length - 1].n])
    .range([MARGIN.left, width - MARGIN.right]);
  const vals = pts.flatMap((p) => [p.value, p.lo ?? p.value, p.hi ?? p.value]).map((v) => v * k);
  const y = scaleLinear()
    .domain([Math.min(...vals), Math.max(...vals)])
    .range([height - MARGIN.bottom, MARGIN.top])
    .nice();
  const line = pts.map((p, i) => `${i ? 'L' : 'M'}${x(p.n)},${y(p.value * k)}`).join('');
  const band =
    pts.every((p) => p.lo !== undefined && p.hi !== undefined) &&
    pts.map((p, i) => `${i ? 'L' : 'M'}${x(p.n)},${y(p.hi! * k)}`).join('') +
      [...pts]
        .reverse()
        .map((p) => `L${x(p.n)},${y(p.lo! * k)}`)
        .join('') +
      'Z';
  const xTicks = x.ticks(5).filter((t) => Number.isInteger(Math.log10(t)));
  return (
    <ChartSvg svgRef={svgRef} width={width} height={height} label={label}>
      <ValueAxis scale={y} width={width} unit={percent ? '%' : ''} ticks={4} />
      {band && <path d={band} fill={SERIES_COLOURS[1]} fillOpacity={0.15} />}
      <path d={line} fill="none" stroke={SERIES_COLOURS[0]} strokeWidth={1.8} />
      <line
        x1={MARGIN.left}
        x2={width - MARGIN.right}
        y1={height - MARGIN.bottom}
        y2={height - MARGIN.bottom}
        stroke={DIM}
      />
      {xTicks.map((t) => (
        <text
          key={t}
          x={x(t)}
          y={height - MARGIN.bottom + 15}
          fontSize={10}
          fill={DIM}
          textAnchor="middle"
          fontFamily={MONO}
        >
          {t >= 1000 ? `1e${Math.round(Math.log10(t))}` : t}
        </text>
      ))}
      <text x={width - MARGIN.right} y={height - 6} fontSize={10} fill={DIM} textAnchor="end">
        samples drawn (log scale){percent ? ' · yield %' : ''}
      </text>
    </ChartSvg>
  );
}
