import type { ReactNode, Ref } from 'react';
import { FONT } from './chartTheme.js';

/**
 * The root <svg> of a chart: a `width` × `height` viewBox that scales to its container's width,
 * announced as an image named `label`. `svgRef` is what the download buttons export.
 */
export function ChartSvg({
  svgRef,
  width,
  height,
  label,
  children,
}: {
  svgRef?: Ref<SVGSVGElement>;
  width: number;
  height: number;
  label: string;
  children: ReactNode;
}) {
  return (
    <svg
      ref={svgRef}
      viewBox={`0 0 ${width} ${height}`}
      className="h-auto w-full"
      role="img"
      aria-label={label}
      fontFamily={FONT}
    >
      {children}
    </svg>
  );
}
