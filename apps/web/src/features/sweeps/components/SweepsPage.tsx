import {
  DESIGN_BOUNDS,
  MAX_DESIGN_FREQUENCY_RATIO,
  type BridgeScheme,
  type ZeroSequence,
} from '@pulsewright/modulation';
import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/Button';
import {
  NumberField,
  numberListText,
  ParsedField,
  parseNumberList,
  SelectField,
} from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState, QueryView } from '../../../components/ui/QueryState';
import { rangeError, rangeText } from '../../../lib/fieldRange';
import { formatDate } from '../../../lib/format';
import { LossSweepPanel } from './LossSweepPanel';
import { SweepCharts } from './SweepCharts';
import {
  METHOD_OPTIONS,
  SCHEME_OPTIONS,
  ZERO_SEQUENCE_OPTIONS,
  type Option,
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

type SweepMethod = 'sine-triangle' | 'three-phase';

/** The methods a sweep of the service takes (carrier PWM), from the library's list. */
const SWEEP_METHOD_OPTIONS = METHOD_OPTIONS.filter(
  (o): o is Option<SweepMethod> => o.value === 'sine-triangle' || o.value === 'three-phase',
);

const MA_BOUNDS = DESIGN_BOUNDS['modulation.ma'];
/** The frequency ratio: a whole number up to the library's largest. */
const RATIO_BOUNDS = { min: 1, max: MAX_DESIGN_FREQUENCY_RATIO, integer: true };
/** Points and highest order: the API document's MaSweepRequest (Range.points, maxOrder). */
const POINTS_BOUNDS = { min: 2, max: 400, integer: true };
const MAX_ORDER_BOUNDS = { min: 1, max: 2000, integer: true };
/** At most this many tracked orders (the API document's MaSweepRequest.orders). */
const MAX_TRACKED_ORDERS = 20;

/** Start a sweep of the modulation index on the service and watch it to the end. */
export function SweepsPage() {
  const [method, setMethod] = useState<SweepMethod>('sine-triangle');
  const [scheme, setScheme] = useState<BridgeScheme>('bipolar');
  const [zeroSequence, setZeroSequence] = useState<ZeroSequence>('none');
  const [numbers, setNumbers] = useState({
    mf: 21,
    vdc: 400,
    from: 0.1,
    to: 1.2,
    points: 60,
    maxOrder: 120,
  });
  // Orders whose amplitude is recorded at every ma: the carrier group around the default mf 21.
  const [orders, setOrders] = useState<number[]>([3, 19, 21, 23, 41, 43]);
  const [jobId, setJobId] = useState<string | null>(null);
  const start = useCreateMaSweep();
  const job = useJob(jobId);
  const jobs = useJobs();
  // The library's bounds where it owns them (ma, DC bus); the service names the others' ranges.
  const checks = {
    mf: rangeError('Frequency ratio mf', numbers.mf, RATIO_BOUNDS),
    vdc: rangeError('DC bus', numbers.vdc, DESIGN_BOUNDS.vdc, { unit: 'V' }),
    from: rangeError('ma from', numbers.from, MA_BOUNDS),
    to:
      rangeError('ma to', numbers.to, MA_BOUNDS) ??
      (numbers.to < numbers.from
        ? `ma to must be at least ma from, ${numbers.from} (entered ${numbers.to})`
        : undefined),
    points: rangeError('Points', numbers.points, POINTS_BOUNDS),
    maxOrder: rangeError('Highest order', numbers.maxOrder, MAX_ORDER_BOUNDS),
    orders: ordersError(orders, numbers.maxOrder),
  };
  const valid = Object.values(checks).every((message) => message === undefined);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!valid) return;
    const { mf, vdc, from, to, points, maxOrder } = numbers;
    start.mutate(
      {
        modulation:
          method === 'three-phase'
            ? { method, ma: from, mf, vdc, zeroSequence }
            : { method, scheme, ma: from, mf, vdc },
        ma: { from, to, points },
        maxOrder,
        orders,
      },
      { onSuccess: (created) => setJobId(created.id) },
    );
  };
  const set = (key: keyof typeof numbers) => (value: number) =>
    setNumbers((current) => ({ ...current, [key]: value }));
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
              value={method}
              onValueChange={setMethod}
              options={SWEEP_METHOD_OPTIONS}
            />
            {method === 'three-phase' ? (
              <SelectField
                label="Zero sequence"
                value={zeroSequence}
                onValueChange={setZeroSequence}
                options={ZERO_SEQUENCE_OPTIONS}
              />
            ) : (
              <SelectField
                label="Bridge scheme"
                value={scheme}
                onValueChange={setScheme}
                options={SCHEME_OPTIONS}
              />
            )}
            <NumberField
              label="Frequency ratio mf"
              value={numbers.mf}
              onChange={set('mf')}
              hint={rangeText(RATIO_BOUNDS)}
              validate={() => checks.mf}
              error={err('mf')}
            />
            <NumberField
              label="DC bus"
              unit="V"
              value={numbers.vdc}
              onChange={set('vdc')}
              hint={rangeText(DESIGN_BOUNDS.vdc, { unit: 'V' })}
              validate={() => checks.vdc}
              error={err('vdc')}
            />
            <div className="grid grid-cols-2 gap-3">
              <NumberField
                label="ma from"
                value={numbers.from}
                onChange={set('from')}
                hint={rangeText(MA_BOUNDS)}
                validate={() => checks.from}
                error={err('ma.from') ?? err('from')}
              />
              <NumberField
                label="ma to"
                value={numbers.to}
                onChange={set('to')}
                hint={rangeText(MA_BOUNDS)}
                validate={() => checks.to}
                error={err('ma.to') ?? err('to')}
              />
            </div>
            <NumberField
              label="Points"
              value={numbers.points}
              onChange={set('points')}
              hint={rangeText(POINTS_BOUNDS)}
              validate={() => checks.points}
              error={err('points')}
            />
            <NumberField
              label="Highest order"
              value={numbers.maxOrder}
              onChange={set('maxOrder')}
              hint={rangeText(MAX_ORDER_BOUNDS)}
              validate={() => checks.maxOrder}
              error={err('maxOrder')}
            />
            <ParsedField<number[]>
              label="Harmonic orders to track"
              value={orders}
              format={numberListText}
              parse={parseNumberList}
              onChange={setOrders}
              hint={`their amplitude against ma; whole numbers up to the highest order, at most ${MAX_TRACKED_ORDERS}`}
              validate={() => checks.orders}
              error={err('orders')}
            />
            {start.isError &&
            !['mf', 'vdc', 'from', 'to', 'points', 'maxOrder', 'orders'].some((f) => err(f)) ? (
              <p role="alert" className="text-sm text-bad">
                {errorMessage(start.error)}
              </p>
            ) : null}
            <Button type="submit" busy={start.isPending} disabled={!valid}>
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
      <div className="mt-6">
        <LossSweepPanel />
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
      {result ? <SweepCharts result={result} /> : null}
    </div>
  );
}

/** The message for the tracked orders, or undefined: whole numbers 0 to the highest order, at most 20. */
function ordersError(orders: readonly number[], maxOrder: number): string | undefined {
  if (orders.length > MAX_TRACKED_ORDERS)
    return `Harmonic orders to track: at most ${MAX_TRACKED_ORDERS} (entered ${orders.length})`;
  const highest = Number.isInteger(maxOrder) ? maxOrder : MAX_ORDER_BOUNDS.max;
  for (const order of orders) {
    const message = rangeError('Each tracked order', order, {
      min: 0,
      max: highest,
      integer: true,
    });
    if (message) return message;
  }
  return undefined;
}
