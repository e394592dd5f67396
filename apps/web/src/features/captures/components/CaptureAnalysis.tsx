import { SpectrumChart } from '../../../components/charts/SpectrumChart';
import { SelectField, type FieldOption } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { ErrorState, Loading } from '../../../components/ui/QueryState';
import { formatNumber, formatPercent } from '../../../lib/format';
import type { CaptureSpectrum, CaptureWithSeries, FftWindow } from '../../../lib/api';
import { ComparisonNotes } from './ComparisonNotes';
import { ComparisonTable } from './ComparisonTable';
import { useCaptureAnalysis } from './useCaptureAnalysis';

const WINDOW_OPTIONS: readonly FieldOption<FftWindow>[] = [
  { value: 'hann', label: 'Hann' },
  { value: 'flat-top', label: 'Flat-top' },
  { value: 'rectangular', label: 'Rectangular' },
];

/** A capture's spectrum with its FFT window, optionally set against a study's prediction (chart, notes and table). */
export function CaptureAnalysis({ capture }: { capture: CaptureWithSeries }) {
  const { windowName, setWindowName, studyId, setStudyId, studies, spectrum, comparison, series } =
    useCaptureAnalysis(capture.id);

  return (
    <div className="flex flex-col gap-4" data-testid="capture-analysis">
      <Panel title={capture.name}>
        <p className="text-sm">
          {capture.fileName} · {capture.rows} samples at {formatNumber(capture.sampleRate)} S/s (
          {formatNumber(capture.duration * 1e3)} ms) · columns {capture.columns.join(', ')}
        </p>
        <div className="mt-3 grid gap-3 sm:grid-cols-2">
          <SelectField
            label="FFT window"
            hint={
              spectrum.data?.periodic
                ? 'not applied: this capture repeats exactly over its whole periods, so it is read with no window'
                : 'applied to a capture that is not exactly periodic'
            }
            value={windowName}
            onValueChange={setWindowName}
            options={WINDOW_OPTIONS}
          />
          <SelectField
            label="Compare with study"
            value={studyId}
            onChange={(e) => setStudyId(e.target.value)}
            options={[
              { value: '', label: 'No study' },
              ...(studies.data ?? []).map((s) => ({ value: s.id, label: s.name })),
            ]}
          />
        </div>
        {spectrum.isPending ? <Loading label="Analysing the capture…" /> : null}
        {spectrum.isError ? (
          <ErrorState error={spectrum.error} onRetry={() => spectrum.refetch()} />
        ) : null}
        {spectrum.data ? (
          <p className="mt-2 text-sm">
            Fundamental {formatNumber(spectrum.data.fundamentalFrequency)} Hz
            {spectrum.data.fundamentalEstimated
              ? spectrum.data.periodic
                ? ' (from the whole periods the capture repeats over)'
                : ' (estimated from the capture: its strongest bin, refined by its phase over the periods)'
              : ''}{' '}
            · {spectrumBasis(spectrum.data)} · capture THD {formatPercent(spectrum.data.thd)} to
            order {spectrum.data.harmonics.at(-1)?.order ?? 0}
          </p>
        ) : null}
        {comparison.isPending && studyId ? (
          <Loading label="Comparing with the prediction…" />
        ) : null}
        {comparison.isError ? (
          <ErrorState error={comparison.error} onRetry={() => comparison.refetch()} />
        ) : null}
      </Panel>
      {series.length ? (
        <SpectrumChart
          series={series}
          title={comparison.data ? 'Capture against prediction' : 'Capture spectrum'}
          fileName="capture-spectrum"
          fundamentalFrequency={
            comparison.data?.fundamentalFrequency ?? spectrum.data?.fundamentalFrequency
          }
        />
      ) : null}
      {comparison.data ? <ComparisonNotes comparison={comparison.data} /> : null}
      {comparison.data ? <ComparisonTable comparison={comparison.data} /> : null}
    </div>
  );
}

/** How the capture was read: whole periods at their own length, with or without a window. */
function spectrumBasis(spectrum: CaptureSpectrum): string {
  const span = `${spectrum.periods} whole periods (${spectrum.sampleCount} samples) transformed at that length`;
  return spectrum.periodic
    ? `${span}; the capture repeats exactly over them, so every harmonic falls on a bin and no window is needed`
    : `${span} with the ${spectrum.window} window (coherent gain ${formatNumber(spectrum.coherentGain)})`;
}
