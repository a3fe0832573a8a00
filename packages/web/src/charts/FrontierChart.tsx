import { scaleLinear, scaleLog } from 'd3';
import type { Ref } from 'react';
import { formatPpm } from '../format/formatSi.js';
import { Axis } from './Axis.js';
import { ChartSvg } from './ChartSvg.js';
import { DIM, GRID, MARGIN, MONO, SERIES_COLOURS, SPEC } from './chartTheme.js';

/** One plan on the frontier: cost per unit and reject rate with its interval (PPM). */
export interface FrontierPoint {
  cost: number;
  rejectPpm: number;
  lowPpm: number;
  highPpm: number;
  chosen?: boolean;
}

/**
 * Cost against reject rate: each frontier plan as a dot with its interval as a vertical bar, the
 * reject rate on a log axis (PPM), the target as a dashed line; the chosen plan ringed, and the
 * confirming run's interval beside it when there is one.
 */
export function FrontierChart({
  points,
  targetPpm,
  confirm,
  currency,
  svgRef,
  width = 640,
  height = 300,
}: {
  points: FrontierPoint[];
  targetPpm: number;
  confirm?: { cost: number; rejectPpm: number; lowPpm: number; highPpm: number } | null;
  currency: string;
  svgRef?: Ref<SVGSVGElement>;
  width?: number;
  height?: number;
}) {
  if (points.length === 0) return <p className="text-sm text-dim">No plan on the frontier.</p>;
  const all = [...points, ...(confirm ? [confirm] : [])];
  const floor = 1;
  const lo = Math.max(floor, Math.min(targetPpm, ...all.map((p) => Math.max(p.lowPpm, floor))) / 2);
  const hi = Math.max(targetPpm, ...all.map((p) => p.highPpm)) * 1.6;
  const costs = points.map((p) => p.cost);
  const c0 = Math.min(...costs);
  const c1 = Math.max(...costs);
  const pad = (c1 - c0) * 0.08 || 0.5;
  const x = scaleLinear()
    .domain([c0 - pad, c1 + pad])
    .range([MARGIN.left + 18, width - MARGIN.right])
    .nice();
  const y = scaleLog()
    .domain([lo, hi])
    .range([height - MARGIN.bottom, MARGIN.top]);
  const yTicks = y.ticks(5).filter((t) => [1, 2, 5].includes(Number(t.toPrecision(1)[0])));
  const yv = (v: number) => y(Math.max(v, lo));
  const left = MARGIN.left + 18;
  return (
    <ChartSvg svgRef={svgRef} width={width} height={height} label="Cost per unit against reject rate">
      <g fontFamily={MONO} fontSize={10} fill={DIM}>
        <line x1={left} x2={left} y1={MARGIN.top} y2={height - MARGIN.bottom} stroke={DIM} />
        {yTicks.map((t) => (
          <g key={t} transform={`translate(0,${y(t)})`}>
            <line x1={left} x2={width - MARGIN.right} stroke={GRID} />
            <text x={left - 6} dy="0.32em" textAnchor="end">
              {formatPpm(t).replace(' PPM', '')}
            </text>
          </g>
        ))}
        <text
          transform={`translate(12,${(height - MARGIN.bottom + MARGIN.top) / 2}) rotate(-90)`}
          textAnchor="middle"
        >
          reject rate (PPM, log)
        </text>
      </g>
      <Axis scale={x} orient="bottom" at={height - MARGIN.bottom} ticks={6} />
      <text x={(left + width - MARGIN.right) / 2} y={height - 6} textAnchor="middle" fontSize={10} fill={DIM}>
        cost per unit ({currency})
      </text>
      <line
        x1={left}
        x2={width - MARGIN.right}
        y1={y(targetPpm)}
        y2={y(targetPpm)}
        stroke={SPEC}
        strokeDasharray="5 4"
      />
      <text x={width - MARGIN.right - 4} y={y(targetPpm) - 5} textAnchor="end" fontSize={10} fill={SPEC}>
        target {formatPpm(targetPpm)}
      </text>
      <polyline
        fill="none"
        stroke={SERIES_COLOURS[0]}
        strokeOpacity={0.4}
        points={points.map((p) => `${x(p.cost)},${yv(p.rejectPpm)}`).join(' ')}
      />
      {points.map((p, i) => (
        <g key={i} stroke={SERIES_COLOURS[0]} fill={SERIES_COLOURS[0]}>
          <line x1={x(p.cost)} x2={x(p.cost)} y1={yv(p.lowPpm)} y2={yv(p.highPpm)} strokeWidth={1.5} />
          <circle cx={x(p.cost)} cy={yv(p.rejectPpm)} r={3.5} />
          {p.chosen && (
            <circle
              cx={x(p.cost)}
              cy={yv(p.rejectPpm)}
              r={8}
              fill="none"
              stroke={SERIES_COLOURS[1]}
              strokeWidth={2}
            />
          )}
        </g>
      ))}
      {confirm && (
        <g stroke={SERIES_COLOURS[2]} fill={SERIES_COLOURS[2]}>
          <line
            x1={x(confirm.cost) + 12}
            x2={x(confirm.cost) + 12}
            y1={yv(confirm.lowPpm)}
            y2={yv(confirm.highPpm)}
            strokeWidth={2}
          />
          <rect x={x(confirm.cost) + 9} y={yv(confirm.rejectPpm) - 3} width={6} height={6} />
          <text x={x(confirm.cost) + 18} y={yv(confirm.rejectPpm) + 3} fontSize={10} stroke="none">
            confirming run
          </text>
        </g>
      )}
    </ChartSvg>
  );
}
