import { extent, scaleLinear } from 'd3';
import type { Ref } from 'react';
import { Axis } from './Axis.js';
import { ChartSvg } from './ChartSvg.js';
import { ValueAxis } from './ValueAxis.js';
import { DIM, MARGIN, SERIES_COLOURS, SPEC } from './chartTheme.js';

interface ScatterProps {
  xs: number[];
  ys: number[];
  xLabel: string;
  yLabel: string;
  xUnit: string;
  yUnit: string;
  specMin?: number;
  specMax?: number;
  svgRef?: Ref<SVGSVGElement>;
  width?: number;
  height?: number;
}

/** A metric against a part value, one dot per sample; spec limits as horizontal lines. */
export function Scatter({
  xs,
  ys,
  xLabel,
  yLabel,
  xUnit,
  yUnit,
  specMin,
  specMax,
  svgRef,
  width = 460,
  height = 260,
}: ScatterProps) {
  const pts: [number, number][] = [];
  for (let i = 0; i < xs.length; i++)
    if (Number.isFinite(xs[i]) && Number.isFinite(ys[i])) pts.push([xs[i], ys[i]]);
  const [x0, x1] = extent(pts, (p) => p[0]) as [number, number];
  const [y0, y1] = extent(pts, (p) => p[1]) as [number, number];
  if (x0 === undefined || y0 === undefined)
    return <p className="text-sm text-dim">No finite samples to plot.</p>;
  const x = scaleLinear()
    .domain([x0, x1 === x0 ? x0 + 1 : x1])
    .range([MARGIN.left, width - MARGIN.right])
    .nice();
  const y = scaleLinear()
    .domain([Math.min(y0, specMin ?? y0), Math.max(y1 === y0 ? y0 + 1 : y1, specMax ?? y1)])
    .range([height - MARGIN.bottom, MARGIN.top])
    .nice();
  return (
    <ChartSvg svgRef={svgRef} width={width} height={height} label={`${yLabel} against ${xLabel}`}>
      <ValueAxis scale={y} width={width} unit={yUnit} ticks={5} />
      <Axis scale={x} orient="bottom" at={height - MARGIN.bottom} unit={xUnit} ticks={5} />
      <g fill={SERIES_COLOURS[0]} fillOpacity={0.45}>
        {pts.map(([a, b], i) => (
          <circle key={i} cx={x(a)} cy={y(b)} r={1.8} />
        ))}
      </g>
      {[specMin, specMax].map((v, i) =>
        v === undefined ? null : (
          <line
            key={i}
            x1={MARGIN.left}
            x2={width - MARGIN.right}
            y1={y(v)}
            y2={y(v)}
            stroke={SPEC}
            strokeDasharray="5 3"
          />
        ),
      )}
      <text
        x={(MARGIN.left + width - MARGIN.right) / 2}
        y={height - 6}
        fontSize={10}
        fill={DIM}
        textAnchor="middle"
      >
        {xLabel}
      </text>
      <text
        transform={`translate(12,${(MARGIN.top + height - MARGIN.bottom) / 2}) rotate(-90)`}
        fontSize={10}
        fill={DIM}
        textAnchor="middle"
      >
        {yLabel}
      </text>
    </ChartSvg>
  );
}
