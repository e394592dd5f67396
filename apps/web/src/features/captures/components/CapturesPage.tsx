import { designFrequencyRatio, labelHarmonics, type InverterDesign } from '@pulsewright/modulation';
import { useRef, useState, type FormEvent } from 'react';
import { SpectrumChart, type SpectrumSeries } from '../../../components/charts/SpectrumChart';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField, type FieldOption } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState, Loading, QueryView } from '../../../components/ui/QueryState';
import { formatDate, formatNumber, formatPercent } from '../../../lib/format';
import {
  errorMessage,
  fieldErrorOf,
  roleAtLeast,
  useCapture,
  useCaptureComparison,
  useCaptureSpectrum,
  useCaptures,
  useMe,
  useStudies,
  useUploadCapture,
  type CaptureComparison,
  type CaptureSpectrum,
  type CaptureWithSeries,
  type FftWindow,
} from '../../../lib/api';

const WINDOW_OPTIONS: readonly FieldOption<FftWindow>[] = [
  { value: 'hann', label: 'Hann' },
  { value: 'flat-top', label: 'Flat-top' },
  { value: 'rectangular', label: 'Rectangular' },
];

function UploadForm({ onUploaded }: { onUploaded: (id: string) => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [name, setName] = useState('');
  const [progress, setProgress] = useState(0);
  const upload = useUploadCapture();
  const input = useRef<HTMLInputElement>(null);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!file) return;
    setProgress(0);
    upload.mutate(
      { file, name: name || file.name.replace(/\.[^.]+$/, ''), onProgress: setProgress },
      {
        onSuccess: (capture) => {
          onUploaded(capture.id);
          setFile(null);
          setName('');
          if (input.current) input.current.value = '';
        },
      },
    );
  };
  const percent = Math.round(progress * 100);
  return (
    <Panel title="Upload a capture">
      <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
        <div className="flex flex-col gap-1">
          <label
            htmlFor="capture-file"
            className="text-xs font-medium tracking-wide text-ink-soft uppercase"
          >
            CSV file (time, voltage, optional current; at most 5 MB)
          </label>
          <input
            id="capture-file"
            ref={input}
            type="file"
            accept=".csv,text/csv"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            className="text-sm"
            aria-describedby="capture-file-error"
          />
          {fieldErrorOf(upload.error, 'file') ? (
            <p id="capture-file-error" role="alert" className="text-xs text-bad">
              {fieldErrorOf(upload.error, 'file')}
            </p>
          ) : null}
        </div>
        <TextField
          label="Name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          error={fieldErrorOf(upload.error, 'name')}
        />
        {upload.isPending || upload.isSuccess ? (
          <div>
            <div className="mb-1 flex justify-between text-xs">
              <span>{upload.isSuccess ? 'Uploaded' : 'Uploading'}</span>
              <span className="num">{percent} %</span>
            </div>
            <div
              role="progressbar"
              aria-label="Upload progress"
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={percent}
              className="h-3 overflow-hidden rounded-full bg-rule"
            >
              <div className="h-full bg-signal" style={{ width: `${percent}%` }} />
            </div>
          </div>
        ) : null}
        {upload.isError && !fieldErrorOf(upload.error, 'file') ? (
          <p role="alert" className="text-sm text-bad">
            {errorMessage(upload.error)}
          </p>
        ) : null}
        <Button type="submit" busy={upload.isPending} disabled={!file}>
          Upload
        </Button>
      </form>
    </Panel>
  );
}

/** Bench captures: upload with progress, and a capture's spectrum against a study's prediction. */
export function CapturesPage() {
  const me = useMe();
  const canUpload = roleAtLeast(me.data?.role, 'engineer');
  const captures = useCaptures();
  const [selected, setSelected] = useState<string | null>(null);
  return (
    <div>
      <PageHeader
        title="Bench captures"
        subtitle="Measured output voltage from the bench, analysed over whole periods by FFT (with a window when it is not exactly periodic) and set against a study's prediction."
      />
      <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
        <div className="flex flex-col gap-4">
          {canUpload ? (
            <UploadForm onUploaded={setSelected} />
          ) : (
            <Panel>
              <p className="text-sm">Uploading needs the engineer role.</p>
            </Panel>
          )}
          <Panel title="Captures">
            <QueryView query={captures} empty="No captures uploaded yet.">
              {(list) => (
                <ul className="flex flex-col gap-1 text-sm">
                  {list.map((c) => (
                    <li key={c.id}>
                      <button
                        type="button"
                        aria-pressed={selected === c.id}
                        className={`w-full rounded px-2 py-1 text-left ${selected === c.id ? 'bg-signal-soft' : 'hover:bg-paper'}`}
                        onClick={() => setSelected(c.id)}
                      >
                        <span className="font-medium">{c.name}</span>
                        <span className="block text-xs text-ink-soft">
                          {c.rows} rows · {formatNumber(c.sampleRate)} S/s ·{' '}
                          {formatDate(c.createdAt)}
                        </span>
                      </button>
                    </li>
                  ))}
                </ul>
              )}
            </QueryView>
          </Panel>
        </div>
        <div className="min-w-0">
          {selected ? (
            <CaptureDetail id={selected} />
          ) : (
            <Panel>
              <p className="text-sm text-ink-soft">Pick or upload a capture.</p>
            </Panel>
          )}
        </div>
      </div>
    </div>
  );
}

function CaptureDetail({ id }: { id: string }) {
  const capture = useCapture(id);
  if (capture.isPending) return <Loading label="Loading the capture…" />;
  if (capture.isError)
    return <ErrorState error={capture.error} onRetry={() => capture.refetch()} />;
  return <CaptureAnalysis capture={capture.data} />;
}

function CaptureAnalysis({ capture }: { capture: CaptureWithSeries }) {
  const [windowName, setWindowName] = useState<FftWindow>('hann');
  const [studyId, setStudyId] = useState('');
  const studies = useStudies();
  const study = studies.data?.find((s) => s.id === studyId);
  const spectrum = useCaptureSpectrum(capture.id, windowName);
  const comparison = useCaptureComparison(capture.id, studyId || null, windowName);
  const mf = study ? frequencyRatioOf(study.design) : 0;
  const label = (bars: { order: number; amplitude: number }[]) =>
    mf
      ? labelHarmonics(
          bars.map((b) => ({ ...b, phase: 0 })),
          mf,
        )
      : bars;
  const series: SpectrumSeries[] = [];
  if (comparison.data) {
    series.push({
      name: `Capture (${windowLabel(comparison.data)})`,
      color: 'var(--color-trace-current)',
      harmonics: label(
        comparison.data.orders.map((o) => ({ order: o.order, amplitude: o.measured })),
      ),
    });
    series.push({
      name: `Prediction: ${study?.name ?? 'study'} (revision ${comparison.data.studyRevision})`,
      color: 'var(--color-ink)',
      harmonics: label(
        comparison.data.orders.map((o) => ({ order: o.order, amplitude: o.predicted })),
      ),
    });
  } else if (spectrum.data) {
    series.push({
      name: `Capture (${windowLabel(spectrum.data)})`,
      color: 'var(--color-trace-current)',
      harmonics: spectrum.data.harmonics,
    });
  }

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

/** The window the service applied, in words: none for an exactly periodic capture. */
function windowLabel(analysis: { periodic: boolean; window: string }): string {
  return analysis.periodic ? 'exactly periodic, no window' : `${analysis.window} window`;
}

/** How the capture was read: whole periods at their own length, with or without a window. */
function spectrumBasis(spectrum: CaptureSpectrum): string {
  const span = `${spectrum.periods} whole periods (${spectrum.sampleCount} samples) transformed at that length`;
  return spectrum.periodic
    ? `${span}; the capture repeats exactly over them, so every harmonic falls on a bin and no window is needed`
    : `${span} with the ${spectrum.window} window (coherent gain ${formatNumber(spectrum.coherentGain)})`;
}

function ComparisonNotes({ comparison }: { comparison: CaptureComparison }) {
  return (
    <Panel title="What was compared">
      {comparison.warnings.length ? (
        <ul role="alert" className="mb-2 flex flex-col gap-1 text-sm text-bad">
          {comparison.warnings.map((warning) => (
            <li key={warning}>{warning}</li>
          ))}
        </ul>
      ) : null}
      <p className="text-sm">
        Orders 1 to {comparison.maxOrder} (the study&apos;s third carrier group and its sidebands
        unless asked otherwise) · capture fundamental{' '}
        {formatNumber(comparison.fundamentalFrequency)} Hz, study{' '}
        {formatNumber(comparison.studyFundamentalFrequency)} Hz · capture THD{' '}
        {formatPercent(comparison.measuredThd)} over the orders compared.
      </p>
      <p className="mt-1 text-sm text-ink-soft">
        Measured / predicted is given only where the prediction is above the noise floor,{' '}
        {formatPercent(comparison.ratioFloor)} of the predicted fundamental (
        {formatNumber(comparison.noiseFloor)} V): below it the ratio of two small numbers says
        nothing about the prediction.
      </p>
    </Panel>
  );
}

function ComparisonTable({ comparison }: { comparison: CaptureComparison }) {
  const rows = comparison.orders.filter(
    (o) =>
      o.order === 1 ||
      o.predicted > 1e-3 * (comparison.orders[0]?.predicted ?? 1) ||
      o.measured > 1e-3 * (comparison.orders[0]?.measured ?? 1),
  );
  return (
    <Panel title="Order by order">
      <div className="max-h-72 overflow-auto">
        <table className="num w-full text-sm">
          <thead className="sticky top-0 bg-panel text-left text-xs text-ink-soft">
            <tr>
              <th scope="col">Order</th>
              <th scope="col">Hz</th>
              <th scope="col">Measured (V)</th>
              <th scope="col">Predicted (V)</th>
              <th scope="col">Measured / predicted</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((o) => (
              <tr key={o.order} className="border-t border-rule/60">
                <td>{o.order}</td>
                <td>{formatNumber(o.frequency)}</td>
                <td>{formatNumber(o.measured)}</td>
                <td>{formatNumber(o.predicted)}</td>
                <td>{o.ratio === null ? '—' : formatNumber(o.ratio)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </Panel>
  );
}

/** The study's frequency ratio for the carrier-group labels (0 for a stored pattern: no labels). */
function frequencyRatioOf(design: InverterDesign): number {
  if (design.carrierFrequency === undefined) return 0;
  try {
    return designFrequencyRatio(design);
  } catch {
    return 0;
  }
}
