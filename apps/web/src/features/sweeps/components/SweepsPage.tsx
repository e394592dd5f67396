import type { ZeroSequence } from '@pulsewright/modulation';
import { useState, type FormEvent } from 'react';
import { LineChart } from '../../../components/charts/LineChart';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState, QueryView } from '../../../components/ui/QueryState';
import { formatDate, formatPercent } from '../../../lib/format';
import {
  METHOD_OPTIONS,
  SCHEME_OPTIONS,
  ZERO_SEQUENCE_OPTIONS,
} from '../../../lib/modulationOptions';
import {
  errorMessage,
  fieldErrorOf,
  maSweepResultOf,
  useCreateMaSweep,
  useJob,
  useJobs,
  type Job,
} from '../../../lib/api';

export function ProgressBar({ value, label }: { value: number; label: string }) {
  const percent = Math.round(Math.min(1, Math.max(0, value)) * 100);
  return (
    <div>
      <div className="mb-1 flex justify-between text-xs">
        <span>{label}</span>
        <span className="num">{percent} %</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        className="h-3 overflow-hidden rounded-full bg-rule"
      >
        <div className="h-full bg-signal transition-[width]" style={{ width: `${percent}%` }} />
      </div>
    </div>
  );
}

/** Start a sweep of the modulation index on the service and watch it to the end. */
export function SweepsPage() {
  const [form, setForm] = useState({
    method: 'sine-triangle',
    scheme: 'bipolar',
    zeroSequence: 'none',
    mf: 21,
    vdc: 400,
    from: 0.1,
    to: 1.2,
    points: 60,
    maxOrder: 120,
  });
  const [jobId, setJobId] = useState<string | null>(null);
  const start = useCreateMaSweep();
  const job = useJob(jobId);
  const jobs = useJobs();
  const submit = (event: FormEvent) => {
    event.preventDefault();
    start.mutate(
      {
        modulation:
          form.method === 'three-phase'
            ? {
                method: 'three-phase',
                ma: form.from,
                mf: form.mf,
                vdc: form.vdc,
                zeroSequence: form.zeroSequence as ZeroSequence,
              }
            : {
                method: 'sine-triangle',
                scheme: form.scheme as 'bipolar' | 'unipolar',
                ma: form.from,
                mf: form.mf,
                vdc: form.vdc,
              },
        ma: { from: form.from, to: form.to, points: form.points },
        maxOrder: form.maxOrder,
      },
      { onSuccess: (created) => setJobId(created.id) },
    );
  };
  const num = (key: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement>) =>
    setForm({ ...form, [key]: Number(e.target.value) });
  const err = (path: string) => fieldErrorOf(start.error, path);

  return (
    <div>
      <PageHeader
        title="Index sweeps"
        subtitle="THD, WTHD and harmonic amplitudes of carrier PWM across a range of the modulation index, computed as a job on the service."
      />
      <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
        <Panel title="Sweep">
          <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
            <SelectField
              label="Method"
              value={form.method}
              onChange={(e) => setForm({ ...form, method: e.target.value })}
              options={METHOD_OPTIONS.filter(
                (o) => o.value === 'sine-triangle' || o.value === 'three-phase',
              )}
            />
            {form.method === 'three-phase' ? (
              <SelectField
                label="Zero sequence"
                value={form.zeroSequence}
                onChange={(e) => setForm({ ...form, zeroSequence: e.target.value })}
                options={ZERO_SEQUENCE_OPTIONS}
              />
            ) : (
              <SelectField
                label="Bridge scheme"
                value={form.scheme}
                onChange={(e) => setForm({ ...form, scheme: e.target.value })}
                options={SCHEME_OPTIONS}
              />
            )}
            <TextField
              label="Frequency ratio mf"
              type="number"
              value={form.mf}
              onChange={num('mf')}
              hint="whole number, 1 to 1000"
              error={err('mf')}
            />
            <TextField
              label="DC bus"
              unit="V"
              type="number"
              value={form.vdc}
              onChange={num('vdc')}
              hint="above 0, up to 100000"
              error={err('vdc')}
            />
            <div className="grid grid-cols-2 gap-3">
              <TextField
                label="ma from"
                type="number"
                step={0.01}
                value={form.from}
                onChange={num('from')}
                hint="above 0"
                error={err('ma.from') ?? err('from')}
              />
              <TextField
                label="ma to"
                type="number"
                step={0.01}
                value={form.to}
                onChange={num('to')}
                hint="up to 4"
                error={err('ma.to') ?? err('to')}
              />
            </div>
            <TextField
              label="Points"
              type="number"
              value={form.points}
              onChange={num('points')}
              hint="2 to 400"
              error={err('points')}
            />
            <TextField
              label="Highest order"
              type="number"
              value={form.maxOrder}
              onChange={num('maxOrder')}
              hint="1 to 2000"
              error={err('maxOrder')}
            />
            {start.isError &&
            !['mf', 'vdc', 'from', 'to', 'points', 'maxOrder'].some((f) => err(f)) ? (
              <p role="alert" className="text-sm text-bad">
                {errorMessage(start.error)}
              </p>
            ) : null}
            <Button type="submit" busy={start.isPending}>
              Run the sweep
            </Button>
          </form>
        </Panel>
        <div className="flex min-w-0 flex-col gap-4">
          {jobId ? (
            <SweepJob job={job.data} error={job.error} />
          ) : (
            <Panel>
              <p className="text-sm text-ink-soft">Run a sweep to see THD and WTHD against ma.</p>
            </Panel>
          )}
          <Panel title="Recent jobs">
            <QueryView query={jobs} empty="No jobs yet.">
              {(list) => (
                <ul className="text-sm">
                  {list.map((j) => (
                    <li key={j.id} className="flex justify-between border-t border-rule/60 py-1">
                      <button
                        type="button"
                        className="underline-offset-2 hover:underline"
                        onClick={() => setJobId(j.id)}
                      >
                        {j.kind} · {formatDate(j.createdAt)}
                      </button>
                      <span className="num text-xs">
                        {j.status} {Math.round(j.progress * 100)} %
                      </span>
                    </li>
                  ))}
                </ul>
              )}
            </QueryView>
          </Panel>
        </div>
      </div>
    </div>
  );
}

function SweepJob({ job, error }: { job: Job | undefined; error: unknown }) {
  if (error) return <ErrorState error={error} />;
  if (!job) return <ProgressBar value={0} label="Queued" />;
  const result = maSweepResultOf(job);
  return (
    <div className="flex flex-col gap-4">
      <Panel title="Job">
        <ProgressBar
          value={job.progress}
          label={
            job.status === 'succeeded'
              ? 'Sweep finished'
              : job.status === 'failed'
                ? 'Sweep failed'
                : `Sweep ${job.status}`
          }
        />
        {job.error ? (
          <p role="alert" className="mt-2 text-sm text-bad">
            {job.error}
          </p>
        ) : null}
        {job.status === 'succeeded' ? (
          <p className="mt-2 text-sm text-good" data-testid="sweep-done">
            Finished: {result?.ma.length ?? 0} points.
          </p>
        ) : null}
      </Panel>
      {result ? (
        <>
          <LineChart
            title="THD and WTHD against ma"
            fileName="ma-sweep-distortion"
            xLabel="modulation index ma"
            yLabel="ratio"
            yFormat={(v) => formatPercent(v, 0)}
            series={[
              {
                name: 'THD, exact over the whole waveform',
                color: 'var(--color-ink)',
                x: result.ma,
                y: result.thd,
              },
              {
                name: 'WTHD, exact over the whole waveform',
                color: 'var(--color-signal)',
                x: result.ma,
                y: result.wthd,
              },
            ]}
          />
          {result.harmonics?.length || result.fundamental ? (
            <LineChart
              title="Amplitudes against ma"
              fileName="ma-sweep-harmonics"
              xLabel="modulation index ma"
              yLabel="volts peak"
              series={[
                ...(result.fundamental
                  ? [
                      {
                        name: 'fundamental',
                        color: 'var(--color-trace-ref)',
                        x: result.ma,
                        y: result.fundamental,
                      },
                    ]
                  : []),
                ...(result.harmonics ?? []).slice(0, 5).map((h, i) => ({
                  name: `order ${h.order}`,
                  color: ['#2a8c82', '#c2462e', '#5b6fa8', '#d9822b', '#12263a'][i] ?? '#12263a',
                  x: result.ma,
                  y: h.amplitude,
                  dashed: true,
                })),
              ]}
            />
          ) : null}
        </>
      ) : null}
    </div>
  );
}
