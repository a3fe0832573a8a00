import { useRef, type ReactNode, type RefObject } from 'react';
import { downloadPng, downloadSvg } from './exportChart.js';

/**
 * A titled chart with SVG and PNG download buttons. `children` receives the ref to attach to the
 * chart's root <svg>.
 */
export function ChartFrame({
  title,
  fileName,
  note,
  children,
}: {
  title: string;
  fileName: string;
  note?: ReactNode;
  children: (ref: RefObject<SVGSVGElement | null>) => ReactNode;
}) {
  const ref = useRef<SVGSVGElement | null>(null);
  return (
    <figure className="print-break rounded-lg border border-rule bg-sheet p-3">
      <figcaption className="mb-1 flex items-center justify-between gap-2">
        <span className="text-sm font-medium text-ink">{title}</span>
        <span className="no-print flex gap-1 text-xs">
          <button
            type="button"
            className="rounded border border-rule px-1.5 py-0.5 text-dim hover:text-ink"
            onClick={() => ref.current && downloadSvg(ref.current, fileName)}
            aria-label={`Download ${title} as SVG`}
          >
            SVG
          </button>
          <button
            type="button"
            className="rounded border border-rule px-1.5 py-0.5 text-dim hover:text-ink"
            onClick={() => ref.current && void downloadPng(ref.current, fileName)}
            aria-label={`Download ${title} as PNG`}
          >
            PNG
          </button>
        </span>
      </figcaption>
      {children(ref)}
      {note && <p className="mt-1 text-xs text-dim">{note}</p>}
    </figure>
  );
}
