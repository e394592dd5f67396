import { useQueries } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { SpectrumChart, type SpectrumSeries } from '../../../components/charts/SpectrumChart';
import { optionValue, type FieldOption } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { Empty, ErrorState, Loading, QueryView } from '../../../components/ui/QueryState';
import { Button } from '../../../components/ui/Button';
import { downloadText, toCsv } from '../../../lib/download';
import { formatGain, formatNumber, formatPercent } from '../../../lib/format';
import {
  studyQueryOptions,
  studyReportQueryOptions,
  useStudies,
  type StudyReport,
} from '../../../lib/api';
import { limitPointName } from '../model/reportFigures';

const COLOURS = ['#12263a', '#d9822b', '#2a8c82', '#8e3b6e', '#c2462e', '#5b6fa8'];

/** Which voltage's spectra are overlaid: the bridge's (phase a), or the point of coupling's (the filter's output where there is one). */
type SpectrumChoice = 'bridge' | 'coupling';

const SPECTRUM_CHOICES: readonly FieldOption<SpectrumChoice>[] = [
  { value: 'bridge', label: 'Bridge voltage' },
  { value: 'coupling', label: 'Point of coupling (filter output)' },
];

/** A column of the figures table: its heading and the cell of one report. */
interface Column {
  heading: string;
  cell: (report: StudyReport) => string;
  title?: (report: StudyReport) => string;
  /** The figure in the report's units, for sorting and the CSV; null where the study has none. */
  value?: (report: StudyReport) => number | null;
}

const phaseA = (report: StudyReport) => report.currents[0];

/** Every column comes from the same design report of each study. */
const COLUMNS: Column[] = [
  { heading: 'Method', cell: (r) => r.methodLabel },
  {
    heading: 'Fundamental (V peak)',
    cell: (r) => formatNumber(r.bridge.fundamental),
    value: (r) => r.bridge.fundamental,
    title: (r) => r.bridge.name,
  },
  {
    heading: 'THD, exact',
    cell: (r) => formatPercent(r.bridge.thd),
    value: (r) => r.bridge.thd,
    title: (r) => `whole waveform, ${r.bridge.name}`,
  },
  {
    heading: 'WTHD, exact',
    cell: (r) => formatPercent(r.bridge.wthd, 3),
    value: (r) => r.bridge.wthd,
    title: (r) => `whole waveform, ${r.bridge.name}`,
  },
  {
    heading: 'Output THD',
    cell: (r) => (r.output ? formatPercent(r.output.thd) : '—'),
    value: (r) => r.output?.thd ?? null,
    title: (r) => (r.output ? `${r.output.name}, to order ${r.analysisOrder}` : 'no filter'),
  },
  {
    heading: 'Current ripple (A rms)',
    cell: (r) => (phaseA(r) ? formatNumber(phaseA(r)?.inverter.rippleRms ?? Number.NaN) : '—'),
    value: (r) => phaseA(r)?.inverter.rippleRms ?? null,
    title: (r) => phaseA(r)?.inverter.name ?? 'no load or filter',
  },
  {
    heading: 'Switch current (A rms)',
    cell: (r) => (phaseA(r) ? formatNumber(phaseA(r)?.inverter.rms ?? Number.NaN) : '—'),
    value: (r) => phaseA(r)?.inverter.rms ?? null,
    title: (r) => phaseA(r)?.inverter.name ?? 'no load or filter',
  },
  {
    heading: 'Load power (W)',
    cell: (r) => (r.loadPower === null ? '—' : formatNumber(r.loadPower)),
    value: (r) => r.loadPower,
    title: (r) => (r.phaseCount === 3 ? 'into R, all three phases' : 'into R'),
  },
  {
    heading: 'Filter resonance (Hz)',
    cell: (r) => (r.filter ? formatNumber(r.filter.characteristics.resonanceFrequency) : '—'),
    value: (r) => r.filter?.characteristics.resonanceFrequency ?? null,
    title: (r) =>
      r.filter?.gainAtCarrier != null
        ? `gain at the carrier ${formatGain(r.filter.gainAtCarrier)}`
        : 'no filter',
  },
  {
    heading: 'Grid current THD',
    cell: (r) => (r.grid ? formatPercent(r.grid.gridCurrentThd) : '—'),
    value: (r) => r.grid?.gridCurrentThd ?? null,
    title: (r) =>
      r.grid
        ? `phase a; IEEE 519 ${r.grid.limits.ieee519.pass ? 'within' : 'over'}, IEEE 1547 ${r.grid.limits.ieee1547.pass ? 'within' : 'over'} (limits recalled from memory)`
        : 'no grid',
  },
  {
    heading: 'Common mode (V rms)',
    cell: (r) => (r.commonMode ? formatNumber(r.commonMode.rms) : '—'),
    value: (r) => r.commonMode?.rms ?? null,
    title: (r) =>
      r.commonMode
        ? `levels ${r.commonMode.levels.map((l) => formatNumber(l)).join(', ')} V; ${r.commonMode.stepsPerPeriod} steps a period`
        : 'single-phase bridge',
  },
  {
    heading: 'Device switching (Hz)',
    cell: (r) => (r.switching ? formatNumber(r.switching.averageDeviceFrequency) : '—'),
    value: (r) => r.switching?.averageDeviceFrequency ?? null,
    title: (r) =>
      r.switching
        ? `turn-ons of each switch per second, averaged over the period (${r.switching.legEdgesPerPeriod} leg edges a period)`
        : 'single-phase bridge',
  },
  {
    heading: 'Limit check',
    cell: (r) => (r.limitCheck.pass ? 'pass' : 'fail'),
    title: (r) => `${r.limitCheck.standard.name}, ${limitPointName(r)}`,
  },
];

/** Two or more studies side by side: a table of their report figures and overlaid labelled spectra (from the service). */
export function ComparePage() {
  const [params, setParams] = useSearchParams();
  const fromUrl = params.get('ids') ?? '';
  // The ticked studies live in component state so a checkbox changes the moment it is clicked;
  // the URL follows (shareable link) and a link to /compare?ids=… sets the state.
  const [ids, setIds] = useState(() => parseIds(fromUrl));
  const [seenUrl, setSeenUrl] = useState(fromUrl);
  const [choice, setChoice] = useState<SpectrumChoice>('bridge');
  // The column the figures are sorted by (in the order picked when null), ascending or not.
  const [sort, setSort] = useState<{ heading: string; ascending: boolean } | null>(null);
  if (fromUrl !== seenUrl) {
    // The URL changed from outside (a link, back/forward): adopt it while rendering.
    setSeenUrl(fromUrl);
    if (fromUrl !== ids.join(',')) setIds(parseIds(fromUrl));
  }
  useEffect(() => {
    const joined = ids.join(',');
    if (joined !== fromUrl) setParams(joined ? { ids: joined } : {}, { replace: true });
  }, [ids, fromUrl, setParams]);
  const all = useStudies();
  const studies = useQueries({ queries: ids.map((id) => studyQueryOptions(id)) });
  // Compare draws figures and spectra, no time series: the fewest chart samples keep each report
  // small (a filtered mf-400 report is about 1 MB at the default); no figure depends on them.
  const reports = useQueries({
    queries: ids.map((id) => studyReportQueryOptions(id, { points: 64 })),
  });
  const toggle = (id: string) =>
    setIds((current) =>
      current.includes(id) ? current.filter((x) => x !== id) : [...current, id],
    );

  const pending = [...studies, ...reports].some((q) => q.isPending);
  const failed = [...studies, ...reports].find((q) => q.isError);
  const rows = ids.flatMap((id, i) => {
    const study = studies[i]?.data;
    const report = reports[i]?.data;
    return study && report
      ? [{ id, study, report, color: COLOURS[i % COLOURS.length] ?? '#12263a' }]
      : [];
  });
  const sortColumn = COLUMNS.find((c) => c.heading === sort?.heading);
  const ranked = sortColumn?.value
    ? [...rows].sort((x, y) => {
        const a = sortColumn.value?.(x.report) ?? null;
        const b = sortColumn.value?.(y.report) ?? null;
        // Studies without the figure go last either way.
        if (a === null || b === null) return a === null ? (b === null ? 0 : 1) : -1;
        return sort?.ascending ? a - b : b - a;
      })
    : rows;
  const sortBy = (heading: string) =>
    setSort((current) =>
      current?.heading === heading
        ? { heading, ascending: !current.ascending }
        : { heading, ascending: true },
    );
  const figuresCsv = () =>
    toCsv(
      ['study', ...COLUMNS.map((c) => c.heading)],
      ranked.map(({ study, report }) => [
        study.name,
        ...COLUMNS.map((c) => (c.value ? (c.value(report) ?? '') : c.cell(report))),
      ]),
    );
  // Each spectrum keeps its own report's labels: carrier groups for a carrier method, orders for a pattern.
  const series: SpectrumSeries[] = rows.map(({ study, report, color }) => {
    const voltage = choice === 'coupling' && report.output ? report.output : report.bridge;
    return { name: `${study.name} (${voltage.name})`, color, harmonics: voltage.spectrum };
  });

  return (
    <div>
      <PageHeader
        title="Compare studies"
        subtitle="Pick two or more studies: their figures and spectra come from each one's design report, computed by the service at its current revision."
      />
      <div className="grid gap-5 lg:grid-cols-[280px_minmax(0,1fr)]">
        <Panel title="Studies">
          <QueryView query={all} empty="No studies to compare yet.">
            {(list) => (
              <ul className="flex flex-col gap-1 text-sm">
                {list.map((s) => (
                  <li key={s.id}>
                    <label className="flex items-center gap-2">
                      <input
                        type="checkbox"
                        className="accent-signal"
                        checked={ids.includes(s.id)}
                        onChange={() => toggle(s.id)}
                      />
                      {s.name}
                    </label>
                  </li>
                ))}
              </ul>
            )}
          </QueryView>
        </Panel>
        <div className="flex min-w-0 flex-col gap-4">
          {ids.length < 2 ? (
            <Empty>Select at least two studies to compare their figures and spectra.</Empty>
          ) : null}
          {ids.length > 0 && pending ? <Loading label="Analysing the designs…" /> : null}
          {failed ? <ErrorState error={failed.error} onRetry={() => failed.refetch()} /> : null}
          {rows.length ? (
            <>
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
                      {ranked.map(({ id, study, report, color }) => (
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
                              title={c.title?.(report)}
                              className={
                                c.heading === 'Method'
                                  ? 'font-sans text-xs'
                                  : c.heading === 'Limit check'
                                    ? `font-sans font-semibold ${report.limitCheck.pass ? 'text-good' : 'text-bad'}`
                                    : 'whitespace-nowrap'
                              }
                            >
                              {c.cell(report)}
                            </td>
                          ))}
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
                <p className="mt-2 text-xs text-ink-soft">
                  THD and WTHD are exact over the whole waveform of each bridge voltage (per phase,
                  phase to star point, for three-phase designs); currents are of phase a; the limit
                  check reads the voltage at the point of coupling (the filter's output where there
                  is one).
                </p>
              </Panel>
              <SpectrumChart
                series={series}
                title="Spectra overlaid"
                fileName="compare-spectra"
                fundamentalFrequency={sharedFundamental(rows.map((r) => r.report))}
                controls={
                  <select
                    aria-label="Spectra of"
                    className="rounded border border-rule bg-panel px-1.5 py-0.5 text-xs"
                    value={choice}
                    onChange={(e) =>
                      setChoice(optionValue(SPECTRUM_CHOICES, e.target.value) ?? choice)
                    }
                  >
                    {SPECTRUM_CHOICES.map((option) => (
                      <option key={option.value} value={option.value}>
                        {option.label}
                      </option>
                    ))}
                  </select>
                }
              />
              <p className="-mt-2 text-xs text-ink-soft">
                Labels are those of the first study's report (
                {rows[0]?.report.frequencyRatio === null
                  ? 'orders of a stored pattern'
                  : 'carrier groups of its mf'}
                ); hover a bar to read every study at that order.
              </p>
            </>
          ) : null}
        </div>
      </div>
    </div>
  );
}

function parseIds(value: string): string[] {
  return value.split(',').filter(Boolean);
}

/** The fundamental frequency all the compared designs share, hertz (undefined when they differ: no Hz axis). */
function sharedFundamental(
  reports: readonly { fundamentalFrequency: number }[],
): number | undefined {
  const first = reports[0]?.fundamentalFrequency;
  return reports.every((r) => r.fundamentalFrequency === first) ? first : undefined;
}
