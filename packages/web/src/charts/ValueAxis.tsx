import type { ScaleLinear } from 'd3';
import { Axis } from './Axis.js';
import { MARGIN } from './chartTheme.js';

/** The left value axis of a chart laid out with MARGIN, its grid lines across the whole plot width. */
export function ValueAxis({
  scale,
  width,
  unit,
  ticks,
}: {
  scale: ScaleLinear<number, number>;
  /** The chart's width (pixels). */
  width: number;
  unit: string;
  ticks: number;
}) {
  return (
    <Axis
      scale={scale}
      orient="left"
      at={MARGIN.left}
      grid={width - MARGIN.left - MARGIN.right}
      unit={unit}
      ticks={ticks}
    />
  );
}
