import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { LineChart, type LineSeries } from '../../../components/charts/LineChart';
import { SpectrumChart } from '../../../components/charts/SpectrumChart';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState } from '../../../components/ui/QueryState';
import { paths } from '../../../config/paths';
import {
  errorMessage,
  fieldErrorOf,
  roleAtLeast,
  sheSweepResultOf,
  useCreateSheSweep,
  useCreateStudy,
  useJob,
  useMe,
  useProjects,
} from '../../../lib/api';
import { formatNumber, formatPercent } from '../../../lib/format';
import { PATTERN_KIND_OPTIONS } from '../../../lib/modulationOptions';
import { pointSpectrum } from '../model/pointSpectrum';

/** The fundamental frequency a saved pattern study starts with, hertz (edited in the study). */
const SAVED_FUNDAMENTAL_FREQUENCY = 50;

const COLOURS = [
  '#12263a',
  '#d9822b',
  '#2a8c82',
  '#8e3b6e',
  '#c2462e',
  '#5b6fa8',
  '#7a6a2f',
  '#3d8a5a',
];

/** Selective harmonic elimination: solution branches of the angles against the fundamental. */
export function EliminationPage() {
  const me = useMe();
  const canSave = roleAtLeast(me.data?.role, 'engineer');
  const [form, setForm] = useState({
    kind: 'bipolar' as 'bipolar' | 'staircase',
    vdc: 300,
    eliminate: '5, 7',
    from: 0.3,
    to: 0.95,
    points: 40,
  });
  const start = useCreateSheSweep();
  const [jobId, setJobId] = useState<string | null>(null);
  const job = useJob(jobId);
  const running =
    start.isPending || job.data?.status === 'queued' || job.data?.status === 'running';
  // The service follows one solution branch per job.
  const outcome = sheSweepResultOf(job.data);
  const [picked, setPicked] = useState<{ point: number; series: number } | null>(null);
  const save = useCreateStudy();
  const projects = useProjects();
  const navigate = useNavigate();
  const orders = form.eliminate
    .split(/[\s,]+/)
    .filter(Boolean)
    .map(Number);
  const count = orders.length + 1;
  const scale = form.kind === 'staircase' ? count * form.vdc : form.vdc;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setPicked(null);
    // fundamentals are given as a fraction of the largest (4·vdc/π per level, square-wave fundamental)
    start.mutate(
      {
        kind: form.kind,
        vdc: form.vdc,
        count,
        eliminate: orders,
        fundamental: {
          from: ((form.from * 4) / Math.PI) * scale,
          to: ((form.to * 4) / Math.PI) * scale,
          points: form.points,
        },
      },
      {
        onSuccess: (created) => {
          setJobId(created.id);
          setSolvedFor({ kind: form.kind, vdc: form.vdc, orders });
          setTarget((t) => ({ ...t, name: null }));
        },
      },
    );
  };

  // One series per angle of the followed branch, each its own colour; x the fundamental, y the
  // angle in degrees.
  const converged = outcome?.points.filter((p) => p.converged) ?? [];
  const series: LineSeries[] = outcome
    ? Array.from({ length: count }, (_, k) => ({
        name: `α${k + 1}`,
        color: COLOURS[k % COLOURS.length] ?? '#12263a',
        x: converged.map((p) => p.fundamental),
        y: converged.map((p) => ((p.angles[k] ?? Number.NaN) * 180) / Math.PI),
      }))
    : [];
  const pickedPoint = picked ? converged[picked.point] : undefined;
  // The sweep that found the point: its pattern settings, kept apart from later form edits.
  const [solvedFor, setSolvedFor] = useState<{
    kind: 'bipolar' | 'staircase';
    vdc: number;
    orders: number[];
  } | null>(null);
  const [target, setTarget] = useState<{ projectId: string; name: string | null }>({
    projectId: '',
    name: null,
  });
  const projectId = target.projectId || projects.data?.[0]?.id || '';
  const pattern = solvedFor ?? { kind: form.kind, vdc: form.vdc, orders };
  const preview = pickedPoint
    ? pointSpectrum(pattern.kind, pattern.vdc, pickedPoint.angles, pattern.orders)
    : null;
  const defaultName = pickedPoint
    ? `SHE ${pattern.kind} eliminating ${pattern.orders.join(', ')} at ${formatNumber(pickedPoint.fundamental)} V`.slice(
        0,
        120,
      )
    : '';
  const studyName = target.name ?? defaultName;

  const saveStudy = () => {
    if (!pickedPoint || !projectId || !studyName.trim()) return;
    save.mutate(
      {
        projectId,
        name: studyName.trim(),
        note: `Picked on a solution branch of the harmonic-elimination page (${pickedPoint.angles.length} first-quarter angles).`,
        // A pattern has no carrier; the fundamental frequency (for a load or a filter) is set in the study.
        design: {
          vdc: pattern.vdc,
          fundamentalFrequency: SAVED_FUNDAMENTAL_FREQUENCY,
          modulation: {
            method: 'selective-harmonic-elimination',
            kind: pattern.kind,
            angles: pickedPoint.angles,
            eliminate: pattern.orders,
            fundamental: pickedPoint.fundamental,
          },
          load: null,
          filter: null,
        },
      },
      { onSuccess: (study) => navigate(paths.study.getHref(study.id)) },
    );
  };

  return (
    <div>
      <PageHeader
        title="Harmonic elimination"
        subtitle="Quarter-wave symmetric patterns whose first-quarter angles null chosen odd harmonics while setting the fundamental; the service follows a solution branch across the fundamental as a job."
      />
      <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
        <Panel title="Pattern">
          <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
            <SelectField
              label="Pattern"
              value={form.kind}
              onChange={(e) =>
                setForm({ ...form, kind: e.target.value as 'bipolar' | 'staircase' })
              }
              options={PATTERN_KIND_OPTIONS}
            />
            <TextField
              label="DC level"
              unit="V"
              type="number"
              value={form.vdc}
              onChange={(e) => setForm({ ...form, vdc: Number(e.target.value) })}
              error={fieldErrorOf(start.error, 'vdc')}
            />
            <TextField
              label="Orders to eliminate"
              value={form.eliminate}
              onChange={(e) => setForm({ ...form, eliminate: e.target.value })}
              hint={`odd orders ≥ 3; ${count} angles per quarter`}
              error={fieldErrorOf(start.error, 'eliminate') ?? fieldErrorOf(start.error, 'count')}
            />
            <div className="grid grid-cols-2 gap-3">
              <TextField
                label="Fundamental from"
                unit="of square wave"
                type="number"
                step={0.05}
                value={form.from}
                onChange={(e) => setForm({ ...form, from: Number(e.target.value) })}
              />
              <TextField
                label="to"
                unit="of square wave"
                type="number"
                step={0.05}
                value={form.to}
                onChange={(e) => setForm({ ...form, to: Number(e.target.value) })}
              />
            </div>
            <TextField
              label="Points"
              type="number"
              value={form.points}
              onChange={(e) => setForm({ ...form, points: Number(e.target.value) })}
              hint="2 to 400"
              error={
                fieldErrorOf(start.error, 'points') ??
                fieldErrorOf(start.error, 'fundamental.points')
              }
            />
            <Button type="submit" busy={running}>
              Find the branches
            </Button>
          </form>
          {job.data ? (
            <div className="mt-3">
              <div className="mb-1 flex justify-between text-xs">
                <span>Job {job.data.status}</span>
                <span className="num">{Math.round(job.data.progress * 100)} %</span>
              </div>
              <div
                role="progressbar"
                aria-label="Solving"
                aria-valuenow={Math.round(job.data.progress * 100)}
                aria-valuemin={0}
                aria-valuemax={100}
                className="h-3 overflow-hidden rounded-full bg-rule"
              >
                <div
                  className="h-full bg-signal"
                  style={{ width: `${job.data.progress * 100}%` }}
                />
              </div>
            </div>
          ) : null}
        </Panel>
        <div className="flex min-w-0 flex-col gap-4">
          {start.isError ? <ErrorState error={start.error} /> : null}
          {job.isError ? <ErrorState error={job.error} /> : null}
          {job.data?.error ? <ErrorState error={new Error(job.data.error)} /> : null}
          {outcome ? (
            <>
              <Panel>
                <p className="text-sm" data-testid="she-summary">
                  {`One branch followed; solved at ${formatPercent(outcome.solvedFraction, 0)} of the fundamentals asked.`}
                </p>
              </Panel>
              <LineChart
                title="Switching angles against the fundamental"
                fileName="she-branches"
                xLabel="fundamental (V peak)"
                yLabel="angle (degrees)"
                series={series}
                onPick={(si, pi) => setPicked({ point: pi, series: si })}
                picked={picked}
              />
            </>
          ) : null}
          {pickedPoint && preview ? (
            <>
              <Panel title="Picked point">
                <p className="num text-sm">
                  Fundamental {formatNumber(pickedPoint.fundamental)} V · angles{' '}
                  {pickedPoint.angles
                    .map((a) => `${formatNumber((a * 180) / Math.PI)}°`)
                    .join(', ')}{' '}
                  · THD {formatPercent(preview.thd)} (whole waveform)
                </p>
                {canSave ? (
                  <div className="mt-3 grid gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto] sm:items-end">
                    <SelectField
                      label="Project"
                      value={projectId}
                      onChange={(e) => setTarget({ ...target, projectId: e.target.value })}
                      error={fieldErrorOf(save.error, 'projectId')}
                      options={
                        projects.data?.length
                          ? projects.data.map((p) => ({ value: p.id, label: p.name }))
                          : [{ value: '', label: 'No projects yet' }]
                      }
                    />
                    <TextField
                      label="Study name"
                      value={studyName}
                      maxLength={120}
                      onChange={(e) => setTarget({ ...target, name: e.target.value })}
                      error={fieldErrorOf(save.error, 'name')}
                    />
                    <Button
                      onClick={saveStudy}
                      busy={save.isPending}
                      disabled={!projectId || !studyName.trim()}
                    >
                      Save as study
                    </Button>
                  </div>
                ) : (
                  <p className="mt-2 text-xs text-ink-soft">Saving needs the engineer role.</p>
                )}
                {save.isError ? (
                  <p role="alert" className="mt-2 text-sm text-bad">
                    {errorMessage(save.error)}
                  </p>
                ) : null}
              </Panel>
              <SpectrumChart
                series={[
                  {
                    name: 'Picked pattern',
                    color: 'var(--color-ink)',
                    harmonics: preview.spectrum,
                  },
                ]}
                title="Spectrum of the picked pattern"
                fileName="she-point-spectrum"
                labelThreshold={2}
              />
            </>
          ) : null}
        </div>
      </div>
    </div>
  );
}
