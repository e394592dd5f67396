import { useMemo, useState } from 'react';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState } from '../../../components/ui/QueryState';
import type { TimerFormState as FormState } from '../model/timerForm';
import { buildTimerTable } from '../model/timerTables';
import { timerFieldErrors, type TimerField } from '../model/timerFieldErrors';
import { DeadTimeCompensationPanel } from './DeadTimeCompensationPanel';
import { NetlistPanel } from './NetlistPanel';
import { OutputEffectPanels } from './OutputEffectPanels';
import { PatternTablePanel } from './PatternTablePanel';
import { TimerForm } from './TimerForm';
import { TimerTablePanel } from './TimerTablePanel';

/** Controller tables: timer compare values for a timer clock and counting mode, with downloads. */
export function FirmwarePage() {
  const [form, setForm] = useState<FormState>({
    method: 'sine-triangle',
    scheme: 'unipolar',
    zeroSequence: 'none',
    ma: 0.85,
    fundamentalFrequency: 50,
    carrierFrequency: 10_000,
    timerClock: 72e6,
    countingMode: 'centre-aligned',
    counterBits: 16,
    deadTimeNs: 500,
    minPulseNs: 0,
    vdc: 360,
    transistorDropV: 0,
    diodeDropV: 0,
    prefix: 'pwm_table',
  });
  // The field typed last: an error that two fields share (carrier against timer clock) goes there.
  const [lastEdited, setLastEdited] = useState<TimerField>('carrierFrequency');
  // Both 0: ideal switches, no drops to model.
  const { transistorDropV, diodeDropV } = form;
  const onStateDrop = useMemo(
    () =>
      transistorDropV === 0 && diodeDropV === 0
        ? undefined
        : { transistor: transistorDropV, diode: diodeDropV },
    [transistorDropV, diodeDropV],
  );
  const outcome = useMemo(
    () =>
      buildTimerTable(
        {
          modulation:
            form.method === 'sine-triangle'
              ? { method: 'sine-triangle', scheme: form.scheme, ma: form.ma }
              : { method: 'three-phase', zeroSequence: form.zeroSequence, ma: form.ma },
          fundamentalFrequency: form.fundamentalFrequency,
          carrierFrequency: form.carrierFrequency,
          timerClock: form.timerClock,
          countingMode: form.countingMode,
          counterBits: form.counterBits,
          deadTime: form.deadTimeNs * 1e-9,
          vdc: form.vdc,
        },
        {
          minPulseWidth: form.minPulseNs * 1e-9,
          ...(onStateDrop === undefined ? {} : { onStateDrop }),
        },
      ),
    [form, onStateDrop],
  );
  // Every keystroke is kept as typed (NaN for an empty box or letters), so the table never quietly
  // uses a previous value; the library then refuses it and the message lands on that field.
  const num = (key: TimerField) => (value: number) => {
    setLastEdited(key);
    setForm((current) => ({ ...current, [key]: value }));
  };
  const errors = timerFieldErrors(outcome.error, form, lastEdited);
  const prefixError = /^[A-Za-z_][A-Za-z0-9_]{0,39}$/.test(form.prefix)
    ? undefined
    : 'Name prefix must be a C identifier of 1 to 40 characters: letters, digits and _, not starting with a digit';
  const table = outcome.table;
  const stem = `timer-table-${form.method}`;

  return (
    <div>
      <PageHeader
        title="Controller tables"
        subtitle="Compare values for a PWM timer, with dead time and the effect of rounding, dead time and minimum pulse on the spectrum. Check on the real gate drive before full voltage."
      />
      <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
        <Panel title="Timer">
          <TimerForm
            form={form}
            setForm={setForm}
            num={num}
            errors={errors}
            prefixError={prefixError}
          />
        </Panel>
        <div className="flex min-w-0 flex-col gap-4">
          {outcome.error && !errors.claimed ? (
            <ErrorState error={new Error(outcome.error.message)} />
          ) : null}
          {outcome.error && errors.claimed ? (
            <p role="status" className="rounded-md border border-rule bg-panel px-3 py-2 text-sm">
              The table waits until the field marked on the left is corrected.
            </p>
          ) : null}
          {table && outcome.effects ? (
            <>
              <TimerTablePanel
                table={table}
                stem={stem}
                prefix={form.prefix}
                prefixError={prefixError}
              />
              <NetlistPanel table={table} fileStem={stem} onStateDrop={onStateDrop} />
              <DeadTimeCompensationPanel table={table} fileStem={stem} prefix={form.prefix} />
              <OutputEffectPanels table={table} effects={outcome.effects} stem={stem} />
            </>
          ) : null}
        </div>
      </div>
      <div className="mt-6">
        <PatternTablePanel />
      </div>
    </div>
  );
}
