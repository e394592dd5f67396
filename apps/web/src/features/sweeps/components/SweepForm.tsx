import { DESIGN_BOUNDS } from '@pulsewright/modulation';
import { Button } from '../../../components/ui/Button';
import {
  NumberField,
  numberListText,
  ParsedField,
  parseNumberList,
  SelectField,
} from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { rangeText } from '../../../lib/fieldRange';
import { SCHEME_OPTIONS, ZERO_SEQUENCE_OPTIONS } from '../../../lib/modulationOptions';
import { errorMessage } from '../../../lib/api';
import {
  MA_BOUNDS,
  MAX_ORDER_BOUNDS,
  MAX_TRACKED_ORDERS,
  POINTS_BOUNDS,
  RATIO_BOUNDS,
  SWEEP_METHOD_OPTIONS,
} from './sweepBounds';
import { useSweepForm } from './useSweepForm';

/** The form of an index sweep: checks every field against its range and starts the job on the service. */
export function SweepForm({ onStarted }: { onStarted: (jobId: string) => void }) {
  const {
    method,
    setMethod,
    scheme,
    setScheme,
    zeroSequence,
    setZeroSequence,
    numbers,
    orders,
    setOrders,
    start,
    checks,
    valid,
    submit,
    set,
    err,
  } = useSweepForm(onStarted);
  return (
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
  );
}
