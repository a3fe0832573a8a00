import { scaleLinear } from 'd3';
import type { Ref } from 'react';
import { formatSi } from '../format/formatSi.js';
import { Axis } from './Axis.js';
import { ChartSvg } from './ChartSvg.js';
import { ValueAxis } from './ValueAxis.js';
import { DIM, MARGIN, SERIES_COLOURS, SPEC } from './chartTheme.js';

export interface HistogramSeries {
  label: string;
  /** Bin edges, length counts.length + 1. */
  edges: number[];
  counts: number[];
}

interface HistogramProps {
  series: HistogramSeries[];
  unit: string;
  specMin?: number;
  specMax?: number;
  width?: number;
  height?: number;
  svgRef?: Ref<SVGSVGElement>;
  label: string;
}

/**
 * Histogram of one metric. One series draws filled bars; several draw outlined steps over shared
 * edges. Heights are shares of each series' samples, so runs of different sizes compare directly.
 */
export function Histogram({
  series,
  unit,
  specMin,
  specMax,
  width = 460,
  height = 220,
  svgRef,
  label,
}: HistogramProps) {
  const all = series.flatMap((s) => s.edges);
  let lo = Math.min(...all, specMin ?? Infinity);
  let hi = Math.max(...all, specMax ?? -Infinity);
  if (!Number.isFinite(lo) || !Number.isFinite(hi))
    return <p className="text-sm text-dim">No finite values to plot.</p>;
  if (lo === hi) {
    lo -= 1;
    hi += 1;
  }
  const pad = (hi - lo) * 0.04;
  const x = scaleLinear()
    .domain([lo - pad, hi + pad])
    .range([MARGIN.left, width - MARGIN.right])
    .nice();
  const shares = series.map((s) => {
    const total = s.counts.reduce((a, b) => a + b, 0) || 1;
    return s.counts.map((c) => c / total);
  });
  const top = Math.max(1e-9, ...shares.flat());
  const y = scaleLinear()
    .domain([0, top * 1.08])
    .range([height - MARGIN.bottom, MARGIN.top])
    .nice();
  const base = y(0);
  const single = series.length === 1;
  return (
    <ChartSvg svgRef={svgRef} width={width} height={height} label={label}>
      <ValueAxis scale={y} width={width} unit="" ticks={4} />
      {series.map((s, si) => {
        const colour = SERIES_COLOURS[si % SERIES_COLOURS.length];
        if (single) {
          return (
            <g key={si} fill={colour} fillOpacity={0.82}>
              {s.counts.map((_, i) => {
                const x0 = x(s.edges[i]);
                const x1 = x(s.edges[i + 1]);
                return (
                  <rect
                    key={i}
                    x={x0 + 0.5}
                    width={Math.max(0.5, x1 - x0 - 1)}
                    y={y(shares[si][i])}
                    height={base - y(shares[si][i])}
                  />
                );
              })}
            </g>
          );
        }
        let d = `M${x(s.edges[0])},${base}`;
        s.counts.forEach((_, i) => {
          d += `V${y(shares[si][i])}H${x(s.edges[i + 1])}`;
        });
        d += `V${base}`;
        return <path key={si} d={d} fill={colour} fillOpacity={0.12} stroke={colour} strokeWidth={1.6} />;
      })}
      <Axis scale={x} orient="bottom" at={base} unit={unit} />
      {[
        { v: specMin, name: 'min' },
        { v: specMax, name: 'max' },
      ].map(({ v, name }) =>
        v === undefined ? null : (
          <g key={name}>
            <line
              x1={x(v)}
              x2={x(v)}
              y1={MARGIN.top - 4}
              y2={base}
              stroke={SPEC}
              strokeWidth={1.6}
              strokeDasharray="5 3"
            />
            <text
              x={x(v) + (name === 'min' ? 4 : -4)}
              y={MARGIN.top + 6}
              fontSize={10}
              fill={SPEC}
              textAnchor={name === 'min' ? 'start' : 'end'}
            >
              spec {name} {formatSi(v, unit)}
            </text>
          </g>
        ),
      )}
      <text x={MARGIN.left} y={height - 6} fontSize={10} fill={DIM}>
        share of samples per bin
      </text>
      {!single &&
        series.map((s, si) => (
          <g
            key={`legend-${si}`}
            transform={`translate(${width - MARGIN.right - (series.length - si) * 64},${height - 15})`}
          >
            <rect width={10} height={10} fill={SERIES_COLOURS[si % SERIES_COLOURS.length]} />
            <text x={14} y={9} fontSize={10} fill={DIM}>
              {s.label}
            </text>
          </g>
        ))}
    </ChartSvg>
  );
}
