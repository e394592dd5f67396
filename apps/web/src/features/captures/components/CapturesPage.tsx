import { fftSpectrum, labelHarmonics, type FftWindowName } from '@pulsewright/modulation';
import { useMemo, useRef, useState, type FormEvent } from 'react';
import { SpectrumChart, type SpectrumSeries } from '../../../components/charts/SpectrumChart';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState, Loading, QueryView } from '../../../components/ui/QueryState';
import { errorMessage, fieldErrorOf } from '../../../lib/api';
import { formatDate, formatNumber, formatPercent } from '../../../lib/format';
import { roleAtLeast, useMe } from '../../auth/api/auth';
import { useCapture, useCaptures, useUploadCapture, type CaptureWithSeries } from '../api/captures';
import { useCaptureStudies, useStudyPrediction } from '../api/prediction';

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
          <label htmlFor="capture-file" className="text-xs font-medium tracking-wide text-ink-soft uppercase">CSV file (time, voltage, optional current; at most 5 MB)</label>
          <input id="capture-file" ref={input} type="file" accept=".csv,text/csv" onChange={(e) => setFile(e.target.files?.[0] ?? null)} className="text-sm" aria-describedby="capture-file-error" />
          {fieldErrorOf(upload.error, 'file') ? <p id="capture-file-error" role="alert" className="text-xs text-bad">{fieldErrorOf(upload.error, 'file')}</p> : null}
        </div>
        <TextField label="Name" value={name} onChange={(e) => setName(e.target.value)} error={fieldErrorOf(upload.error, 'name')} />
        {upload.isPending || upload.isSuccess ? (
          <div>
            <div className="mb-1 flex justify-between text-xs"><span>{upload.isSuccess ? 'Uploaded' : 'Uploading'}</span><span className="num">{percent} %</span></div>
            <div role="progressbar" aria-label="Upload progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={percent} className="h-3 overflow-hidden rounded-full bg-rule">
              <div className="h-full bg-signal" style={{ width: `${percent}%` }} />
            </div>
          </div>
        ) : null}
        {upload.isError && !fieldErrorOf(upload.error, 'file') ? <p role="alert" className="text-sm text-bad">{errorMessage(upload.error)}</p> : null}
        <Button type="submit" busy={upload.isPending} disabled={!file}>Upload</Button>
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
      <PageHeader title="Bench captures" subtitle="Measured output voltage from the bench, analysed with a windowed FFT and set against a study's prediction." />
      <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
        <div className="flex flex-col gap-4">
          {canUpload ? <UploadForm onUploaded={setSelected} /> : <Panel><p className="text-sm">Uploading needs the engineer role.</p></Panel>}
          <Panel title="Captures">
            <QueryView query={captures} empty="No captures uploaded yet.">
              {(list) => (
                <ul className="flex flex-col gap-1 text-sm">
                  {list.map((c) => (
                    <li key={c.id}>
                      <button type="button" aria-pressed={selected === c.id} className={`w-full rounded px-2 py-1 text-left ${selected === c.id ? 'bg-signal-soft' : 'hover:bg-paper'}`} onClick={() => setSelected(c.id)}>
                        <span className="font-medium">{c.name}</span>
                        <span className="block text-xs text-ink-soft">{c.rows} rows · {formatNumber(c.sampleRate)} S/s · {formatDate(c.createdAt)}</span>
                      </button>
                    </li>
                  ))}
                </ul>
              )}
            </QueryView>
          </Panel>
        </div>
        <div className="min-w-0">{selected ? <CaptureDetail id={selected} /> : <Panel><p className="text-sm text-ink-soft">Pick or upload a capture.</p></Panel>}</div>
      </div>
    </div>
  );
}

function CaptureDetail({ id }: { id: string }) {
  const capture = useCapture(id);
  if (capture.isPending) return <Loading label="Loading the capture…" />;
  if (capture.isError) return <ErrorState error={capture.error} onRetry={() => capture.refetch()} />;
  return <CaptureAnalysis capture={capture.data} />;
}

function CaptureAnalysis({ capture }: { capture: CaptureWithSeries }) {
  const [windowName, setWindowName] = useState<FftWindowName>('hann');
  const [studyId, setStudyId] = useState('');
  const studies = useCaptureStudies();
  const study = studies.data?.find((s) => s.id === studyId);
  const prediction = useStudyPrediction(studyId || null, 50);
  const analysis = useMemo(() => {
    try {
      const frequency = study?.load?.frequency;
      return { result: fftSpectrum(capture.series.voltage, capture.sampleRate, { window: windowName, maxOrder: 50, ...(frequency ? { fundamentalFrequency: frequency } : {}) }), error: null };
    } catch (error) {
      return { result: null, error };
    }
  }, [capture, windowName, study]);
  const mf = Number((study?.modulation as { mf?: unknown } | undefined)?.mf) || 1;
  const series: SpectrumSeries[] = [];
  if (analysis.result) series.push({ name: `Capture (${windowName} window)`, color: 'var(--color-trace-current)', harmonics: study ? labelHarmonics(analysis.result.harmonics, mf) : analysis.result.harmonics });
  if (prediction.data && study) series.push({ name: `Prediction: ${study.name}`, color: 'var(--color-ink)', harmonics: labelHarmonics(prediction.data.harmonics.filter((h) => h.order <= 50), mf) });

  return (
    <div className="flex flex-col gap-4" data-testid="capture-analysis">
      <Panel title={capture.name}>
        <p className="text-sm">{capture.fileName} · {capture.rows} samples at {formatNumber(capture.sampleRate)} S/s ({formatNumber(capture.duration * 1e3)} ms) · columns {capture.columns.join(', ')}</p>
        <div className="mt-3 grid gap-3 sm:grid-cols-2">
          <SelectField label="FFT window" value={windowName} onChange={(e) => setWindowName(e.target.value as FftWindowName)} options={[{ value: 'hann', label: 'Hann' }, { value: 'flat-top', label: 'Flat-top' }, { value: 'rectangular', label: 'Rectangular' }]} />
          <SelectField label="Compare with study" value={studyId} onChange={(e) => setStudyId(e.target.value)} options={[{ value: '', label: 'No study' }, ...(studies.data ?? []).map((s) => ({ value: s.id, label: s.name }))]} />
        </div>
        {analysis.result ? (
          <p className="mt-2 text-sm">
            Fundamental {formatNumber(analysis.result.fundamentalFrequency)} Hz{analysis.result.fundamentalEstimated ? ' (estimated from the strongest bin)' : ' (from the study)'} · capture THD {formatPercent(analysis.result.thd)} to order 50
            {prediction.data ? ` · predicted THD ${formatPercent(prediction.data.thd)}` : ''}
          </p>
        ) : null}
        {analysis.error ? <ErrorState error={analysis.error} /> : null}
        {prediction.isError ? <ErrorState error={prediction.error} /> : null}
      </Panel>
      {series.length ? <SpectrumChart series={series} title="Capture against prediction" fileName="capture-spectrum" /> : null}
    </div>
  );
}
