import { useRef, useState, type ReactNode } from 'react';
import { exportPng, exportSvg } from '../../lib/exportChart';
import { Button } from '../ui/Button';

/** A chart's card: title, controls, the SVG, and SVG/PNG export of that SVG. */
export function ChartFrame({
  title,
  fileName,
  controls,
  children,
  footer,
}: {
  title: string;
  fileName: string;
  controls?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
}) {
  const holder = useRef<HTMLDivElement>(null);
  const [exportError, setExportError] = useState<string | null>(null);
  const svg = () => holder.current?.querySelector('svg[data-chart]') as SVGSVGElement | null;
  return (
    <figure className="rounded-lg border border-rule bg-panel p-3 shadow-sm" aria-label={title}>
      <figcaption className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <span className="text-sm font-semibold tracking-wide uppercase">{title}</span>
        <span className="no-print flex flex-wrap items-center gap-1">
          {controls}
          <Button
            variant="ghost"
            onClick={() => {
              const el = svg();
              if (el) exportSvg(el, fileName);
            }}
            aria-label={`Download ${title} as SVG`}
          >
            SVG
          </Button>
          <Button
            variant="ghost"
            aria-label={`Download ${title} as PNG`}
            onClick={() => {
              const el = svg();
              if (el)
                exportPng(el, fileName).catch((error: unknown) => setExportError(String(error)));
            }}
          >
            PNG
          </Button>
        </span>
      </figcaption>
      <div ref={holder} className="relative">
        {children}
      </div>
      {exportError ? (
        <p role="alert" className="text-xs text-bad">
          {exportError}
        </p>
      ) : null}
      {footer}
    </figure>
  );
}
