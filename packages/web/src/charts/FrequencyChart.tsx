import { scaleLinear, scaleLog } from 'd3';
import type { Ref } from 'react';
import { ChartSvg } from './ChartSvg.js';
import { ValueAxis } from './ValueAxis.js';
import { DIM, GRID, MARGIN, MONO, SERIES_COLOURS, SPEC } from './chartTheme.js';

/** One line of a frequency chart: a value per frequency (NaN = gap). */
export interface FrequencySeries {
  label: string;
  values: readonly number[];
  dashed?: boolean;
}

const DECADE_LABEL: Record<number, string> = {
  1: '1',
  10: '10',
  100: '100',
  1e3: '1k',
  1e4: '10k',
  1e5: '100k',
  1e6: '1M',
};

/**
 * Values against frequency on a log axis (Hz): lines, an optional shaded band between `band.lo`
 * and `band.hi`, optional horizontal limits (specs) and a legend.
 */
export function FrequencyChart({
  frequencies,
  series,
  band,
  limits = [],
  unit,
  label,
  svgRef,
  width = 460,
  height = 200,
}: {
  frequencies: readonly number[];
  series: FrequencySeries[];
  band?: { lo: readonly number[]; hi: readonly number[]; label: string };
  limits?: number[];
  unit: string;
  label: string;
  svgRef?: Ref<SVGSVGElement>;
  width?: number;
  height?: number;
}) {
  const f = frequencies;
  const x = scaleLog()
    .domain([f[0], f[f.length - 1]])
    .range([MARGIN.left, width - MARGIN.right]);
  const all = [
    ...series.flatMap((s) => s.values),
    ...(band ? [...band.lo, ...band.hi] : []),
    ...limits,
  ].filter(Number.isFinite);
  let lo = Math.min(...all);
  let hi = Math.max(...all);
  if (!(hi - lo > 1e-9)) {
    lo -= 0.5;
    hi += 0.5;
  }
  const y = scaleLinear()
    .domain([lo, hi])
    .range([height - MARGIN.bottom, MARGIN.top])
    .nice();
  const path = (v: readonly number[]) => {
    let d = '';
    let pen = false;
    v.forEach((val, i) => {
      if (!Number.isFinite(val)) return void (pen = false);
      d += `${pen ? 'L' : 'M'}${x(f[i]).toFixed(1)},${y(val).toFixed(1)}`;
      pen = true;
    });
    return d;
  };
  const bandPath =
    band &&
    band.hi.map((v, i) => `${i ? 'L' : 'M'}${x(f[i]).toFixed(1)},${y(v).toFixed(1)}`).join('') +
      [...band.lo]
        .map((v, i) => [v, i] as const)
        .reverse()
        .map(([v, i]) => `L${x(f[i]).toFixed(1)},${y(v).toFixed(1)}`)
        .join('') +
      'Z';
  const decades = x.ticks().filter((t) => Number.isInteger(Math.log10(t)));
  const bottom = height - MARGIN.bottom;
  return (
    <ChartSvg svgRef={svgRef} width={width} height={height} label={label}>
      <ValueAxis scale={y} width={width} unit={unit} ticks={4} />
      {decades.map((t) => (
        <g key={t}>
          <line x1={x(t)} x2={x(t)} y1={MARGIN.top} y2={bottom} stroke={GRID} />
          <text x={x(t)} y={bottom + 15} fontSize={10} fill={DIM} textAnchor="middle" fontFamily={MONO}>
            {DECADE_LABEL[t] ?? t}
          </text>
        </g>
      ))}
      <line x1={MARGIN.left} x2={width - MARGIN.right} y1={bottom} y2={bottom} stroke={DIM} />
      {bandPath && <path d={bandPath} fill={SERIES_COLOURS[1]} fillOpacity={0.18} />}
      {limits.map((l) => (
        <line
          key={l}
          x1={MARGIN.left}
          x2={width - MARGIN.right}
          y1={y(l)}
          y2={y(l)}
          stroke={SPEC}
          strokeDasharray="4 3"
        />
      ))}
      {series.map((s, i) => (
        <path
          key={s.label}
          d={path(s.values)}
          fill="none"
          stroke={SERIES_COLOURS[i % SERIES_COLOURS.length]}
          strokeWidth={1.8}
          strokeDasharray={s.dashed ? '5 3' : undefined}
        />
      ))}
      <g fontSize={10} fill={DIM}>
        {[...series.map((s) => s.label), ...(band ? [band.label] : [])].map((l, i) => (
          <g key={l} transform={`translate(${MARGIN.left + 8 + i * 120},${MARGIN.top + 4})`}>
            <rect
              width={12}
              height={i < series.length ? 2 : 8}
              y={i < series.length ? 3 : 0}
              fill={i < series.length ? SERIES_COLOURS[i % SERIES_COLOURS.length] : SERIES_COLOURS[1]}
              fillOpacity={i < series.length ? 1 : 0.3}
            />
            <text x={16} y={8}>
              {l}
            </text>
          </g>
        ))}
      </g>
      <text x={width - MARGIN.right} y={height - 6} fontSize={10} fill={DIM} textAnchor="end">
        frequency (Hz, log scale)
      </text>
    </ChartSvg>
  );
}
