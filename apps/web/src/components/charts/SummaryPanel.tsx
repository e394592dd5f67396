import { formatNumber, formatPercent } from '../../lib/format';

export interface SummaryFigures {
  fundamental: number;
  thd: number;
  wthd: number;
  rmsCurrent?: number | undefined;
  power?: number | undefined;
  filteredThd?: number | undefined;
}

/** The headline figures of a study: fundamental, THD, WTHD, RMS current and power. */
export function SummaryPanel({ figures, outputName }: { figures: SummaryFigures; outputName?: string }) {
  const items: [string, string, string][] = [
    ['Fundamental', `${formatNumber(figures.fundamental)} V`, outputName ? `peak, ${outputName}` : 'peak'],
    ['THD', formatPercent(figures.thd), 'orders up to the analysed maximum'],
    ['WTHD', formatPercent(figures.wthd, 3), 'each order weighted by 1/n'],
  ];
  if (figures.rmsCurrent !== undefined) items.push(['RMS current', `${formatNumber(figures.rmsCurrent)} A`, 'steady state']);
  if (figures.power !== undefined) items.push(['Power into R', `${formatNumber(figures.power)} W`, 'R·I rms²']);
  if (figures.filteredThd !== undefined) items.push(['THD after filter', formatPercent(figures.filteredThd), 'LC output']);
  return (
    <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-6" aria-label="Summary" data-testid="summary">
      {items.map(([label, value, note]) => (
        <div key={label} className="rounded-lg border border-rule bg-panel px-3 py-2 shadow-sm">
          <dt className="text-xs tracking-wide text-ink-soft uppercase">{label}</dt>
          <dd className="num text-lg font-semibold" data-figure={label}>
            {value}
          </dd>
          <dd className="text-[11px] text-ink-soft">{note}</dd>
        </div>
      ))}
    </dl>
  );
}
