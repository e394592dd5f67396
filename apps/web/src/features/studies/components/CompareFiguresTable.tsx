import { Panel } from '../../../components/ui/Panel';
import { Button } from '../../../components/ui/Button';
import { downloadText, toCsv } from '../../../lib/download';
import { COLUMNS } from './compareColumns';
import type { ConditionedRow } from './useEqualConditions';

/** The column the figures are sorted by, ascending or not. */
export interface FigureSort {
  heading: string;
  ascending: boolean;
}

/**
 * The figures of the compared studies, one row each, sortable by any numeric column (studies
 * without the figure go last), with a CSV download of the table as shown.
 */
export function CompareFiguresTable({
  rows,
  sort,
  onSort,
  condition,
}: {
  rows: readonly ConditionedRow[];
  /** Null keeps the order the studies were picked in. */
  sort: FigureSort | null;
  onSort: (sort: FigureSort) => void;
  /** What the figures were compared at, in words (the CSV's header says it). */
  condition: string;
}) {
  const sortColumn = COLUMNS.find((c) => c.heading === sort?.heading);
  const ranked = sortColumn?.value
    ? [...rows].sort((x, y) => {
        const a = sortColumn.value?.(x.report, x) ?? null;
        const b = sortColumn.value?.(y.report, y) ?? null;
        // Studies without the figure go last either way.
        if (a === null || b === null) return a === null ? (b === null ? 0 : 1) : -1;
        return sort?.ascending ? a - b : b - a;
      })
    : rows;
  const sortBy = (heading: string) =>
    onSort(
      sort?.heading === heading
        ? { heading, ascending: !sort.ascending }
        : { heading, ascending: true },
    );
  const figuresCsv = () =>
    toCsv(
      [`study (at ${condition})`, ...COLUMNS.map((c) => c.heading)],
      ranked.map((row) => [
        row.study.name,
        ...COLUMNS.map((c) =>
          c.value ? (c.value(row.report, row) ?? '') : c.cell(row.report, row),
        ),
      ]),
    );
  return (
    <Panel
      title="Figures"
      actions={
        <Button
          variant="secondary"
          onClick={() => downloadText(figuresCsv(), 'compare-figures.csv', 'text/csv')}
        >
          CSV
        </Button>
      }
    >
      <div className="overflow-x-auto">
        <table
          className="w-full text-sm [&_td]:px-2 [&_td]:py-1 [&_th]:px-2"
          data-testid="compare-figures"
        >
          <thead className="text-left align-bottom text-xs text-ink-soft uppercase">
            <tr>
              <th scope="col">Study</th>
              {COLUMNS.map((c) => (
                <th
                  scope="col"
                  key={c.heading}
                  aria-sort={
                    sort?.heading === c.heading
                      ? sort.ascending
                        ? 'ascending'
                        : 'descending'
                      : undefined
                  }
                >
                  {c.value ? (
                    <button
                      type="button"
                      className="text-left uppercase underline-offset-2 hover:underline"
                      onClick={() => sortBy(c.heading)}
                    >
                      {c.heading}
                      {sort?.heading === c.heading ? (sort.ascending ? ' ▲' : ' ▼') : ''}
                    </button>
                  ) : (
                    c.heading
                  )}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="num">
            {ranked.map((row) => {
              const { id, study, report, color } = row;
              return (
                <tr key={id} className="border-t border-rule/60" data-study={study.name}>
                  <th scope="row" className="text-left font-sans font-medium">
                    <span
                      className="mr-1 inline-block h-2.5 w-2.5 rounded-sm"
                      style={{ background: color }}
                    />
                    {study.name}
                  </th>
                  {COLUMNS.map((c) => (
                    <td
                      key={c.heading}
                      data-column={c.heading}
                      title={c.title?.(report, row)}
                      className={
                        c.heading === 'Method'
                          ? 'font-sans text-xs'
                          : c.heading === 'Limit check'
                            ? `font-sans font-semibold ${report.limitCheck.pass ? 'text-good' : 'text-bad'}`
                            : 'whitespace-nowrap'
                      }
                    >
                      {c.cell(report, row)}
                    </td>
                  ))}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-xs text-ink-soft">
        THD and WTHD are exact over the whole waveform of each bridge voltage (per phase, phase to
        star point, for three-phase designs); currents are of phase a; the limit check reads the
        voltage at the point of coupling (the filter's output where there is one).
      </p>
    </Panel>
  );
}
