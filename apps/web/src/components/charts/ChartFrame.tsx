import { useRef, useState, type ReactNode } from 'react';
import { downloadText } from '../../lib/download';
import { exportPng, exportSvg } from '../../lib/exportChart';
import { Button } from '../ui/Button';

/**
 * A chart's card: title, controls, the SVG, SVG/PNG export of that SVG, and, when `csv` is
 * given, the chart's data as CSV with units in the header (lib/chartCsv.ts), `<fileName>.csv`.
 */
export function ChartFrame({
  title,
  fileName,
  controls,
  children,
  footer,
  csv,
}: {
  title: string;
  fileName: string;
  controls?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
  /** Builds the CSV of the data drawn (called on click only). */
  csv?: () => string;
}) {
  const holder = useRef<HTMLDivElement>(null);
  const [exportError, setExportError] = useState<string | null>(null);
  const svg = () => holder.current?.querySelector('svg[data-chart]') as SVGSVGElement | null;
  return (
    <figure
      className="rounded-lg border border-rule bg-panel p-3 shadow-sm print:break-inside-avoid"
      aria-label={title}
    >
      <figcaption className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <span className="text-sm font-semibold tracking-wide uppercase">{title}</span>
        <span className="no-print flex flex-wrap items-center gap-1">
          {controls}
          {csv ? (
            <Button
              variant="ghost"
              aria-label={`Download ${title} data as CSV`}
              onClick={() => downloadText(csv(), `${fileName}.csv`, 'text/csv')}
            >
              CSV
            </Button>
          ) : null}
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
