import { SpectrumChart, type SpectrumSeries } from '../../../components/charts/SpectrumChart';
import { optionValue, type FieldOption } from '../../../components/ui/Field';
import type { ComparedRow } from './useComparedStudies';

/** Which voltage's spectra are overlaid: the bridge's (phase a), or the point of coupling's (the filter's output where there is one). */
export type SpectrumChoice = 'bridge' | 'coupling';

const SPECTRUM_CHOICES: readonly FieldOption<SpectrumChoice>[] = [
  { value: 'bridge', label: 'Bridge voltage' },
  { value: 'coupling', label: 'Point of coupling (filter output)' },
];

/** The compared studies' voltage spectra overlaid in one labelled chart, bridge or point of coupling. */
export function CompareSpectra({
  rows,
  choice,
  onChoice,
}: {
  rows: readonly ComparedRow[];
  choice: SpectrumChoice;
  onChoice: (choice: SpectrumChoice) => void;
}) {
  // Each spectrum keeps its own report's labels: carrier groups for a carrier method, orders for a pattern.
  const series: SpectrumSeries[] = rows.map(({ study, report, color }) => {
    const voltage = choice === 'coupling' && report.output ? report.output : report.bridge;
    return { name: `${study.name} (${voltage.name})`, color, harmonics: voltage.spectrum };
  });
  return (
    <>
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
            onChange={(e) => onChoice(optionValue(SPECTRUM_CHOICES, e.target.value) ?? choice)}
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
  );
}

/** The fundamental frequency all the compared designs share, hertz (undefined when they differ: no Hz axis). */
function sharedFundamental(
  reports: readonly { fundamentalFrequency: number }[],
): number | undefined {
  const first = reports[0]?.fundamentalFrequency;
  return reports.every((r) => r.fundamentalFrequency === first) ? first : undefined;
}
