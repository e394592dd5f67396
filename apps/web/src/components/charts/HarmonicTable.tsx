import { useMemo, useState } from 'react';
import { downloadText, toCsv } from '../../lib/download';
import { formatNumber, formatPercent } from '../../lib/format';
import { Button } from '../ui/Button';

export interface HarmonicRow {
  order: number;
  amplitude: number;
  phase: number;
  label?: string;
}

type SortKey = 'order' | 'amplitude' | 'ratio';

/** Sortable table of harmonics with the ratio to the fundamental, and CSV download. */
export function HarmonicTable({
  harmonics,
  title = 'Harmonic table',
  fileName = 'harmonics',
  minRatio = 1e-4,
  unit = 'V',
}: {
  harmonics: readonly HarmonicRow[];
  title?: string;
  fileName?: string;
  minRatio?: number;
  unit?: string;
}) {
  const [sort, setSort] = useState<{ key: SortKey; descending: boolean }>({
    key: 'amplitude',
    descending: true,
  });
  const fundamental = harmonics.find((h) => h.order === 1)?.amplitude ?? 0;
  const rows = useMemo(() => {
    const kept = harmonics.filter(
      (h) => h.order >= 1 && (fundamental === 0 || h.amplitude >= minRatio * fundamental),
    );
    const value = (h: HarmonicRow) => (sort.key === 'order' ? h.order : h.amplitude);
    return [...kept].sort((a, b) => (sort.descending ? value(b) - value(a) : value(a) - value(b)));
  }, [harmonics, sort, fundamental, minRatio]);

  const header = (key: SortKey, text: string) => (
    <th
      scope="col"
      aria-sort={sort.key === key ? (sort.descending ? 'descending' : 'ascending') : 'none'}
      className="px-2 py-1 text-left"
    >
      <button
        type="button"
        className="font-semibold underline-offset-2 hover:underline"
        onClick={() =>
          setSort({ key, descending: sort.key === key ? !sort.descending : key !== 'order' })
        }
      >
        {text} {sort.key === key ? (sort.descending ? '↓' : '↑') : ''}
      </button>
    </th>
  );

  const download = () =>
    downloadText(
      toCsv(
        ['order', 'label', `amplitude_${unit}_peak`, 'phase_rad', 'ratio_to_fundamental'],
        harmonics.map((h) => [
          h.order,
          h.label ?? '',
          h.amplitude,
          h.phase,
          fundamental > 0 ? h.amplitude / fundamental : '',
        ]),
      ),
      `${fileName}.csv`,
      'text/csv',
    );

  return (
    <section className="rounded-lg border border-rule bg-panel p-3 shadow-sm" aria-label={title}>
      <div className="mb-2 flex items-center justify-between">
        <h3 className="text-sm font-semibold tracking-wide uppercase">{title}</h3>
        <Button variant="ghost" className="no-print" onClick={download}>
          Download CSV
        </Button>
      </div>
      <div className="max-h-80 overflow-auto print:max-h-none print:overflow-visible">
        <table className="w-full text-sm">
          <caption className="sr-only">
            Harmonics at or above {formatPercent(minRatio, 2)} of the fundamental
          </caption>
          <thead className="sticky top-0 bg-panel text-xs text-ink-soft">
            <tr>
              {header('order', 'Order')}
              <th scope="col" className="px-2 py-1 text-left">
                Group
              </th>
              {header('amplitude', `Amplitude (${unit})`)}
              {header('ratio', '% of order 1')}
            </tr>
          </thead>
          <tbody className="num">
            {rows.map((h) => (
              <tr key={h.order} className="border-t border-rule/60">
                {/* A span's orders n/q are fractions: six digits (the CSV keeps them whole). */}
                <td className="px-2 py-0.5">{formatNumber(h.order, 6)}</td>
                <td className="px-2 py-0.5">{h.label ?? ''}</td>
                <td className="px-2 py-0.5">{formatNumber(h.amplitude)}</td>
                <td className="px-2 py-0.5">
                  {fundamental > 0 ? formatPercent(h.amplitude / fundamental, 3) : '—'}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
