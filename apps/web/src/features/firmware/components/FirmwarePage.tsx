import { useMemo, useState } from 'react';
import type { TimerZeroSequence } from '@pulsewright/modulation';
import { SpectrumChart } from '../../../components/charts/SpectrumChart';
import { Button } from '../../../components/ui/Button';
import { NumberField, SelectField, TextField } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState } from '../../../components/ui/QueryState';
import { downloadText } from '../../../lib/download';
import { formatNumber, formatPercent } from '../../../lib/format';
import { TIMER_ZERO_SEQUENCE_OPTIONS } from '../../../lib/modulationOptions';
import { buildTimerTable, effectSpectra, timerTableExports } from '../model/timerTables';
import { timerFieldErrors, type TimerField } from '../model/timerFieldErrors';
import { DeadTimeCompensationPanel } from './DeadTimeCompensationPanel';
import { NetlistPanel } from './NetlistPanel';
import { PatternTablePanel } from './PatternTablePanel';

interface FormState {
  method: 'sine-triangle' | 'three-phase';
  scheme: 'bipolar' | 'unipolar';
  zeroSequence: TimerZeroSequence;
  ma: number;
  fundamentalFrequency: number;
  carrierFrequency: number;
  timerClock: number;
  countingMode: 'centre-aligned' | 'edge-aligned';
  counterBits: number;
  deadTimeNs: number;
  minPulseNs: number;
  vdc: number;
  /** Prefix of the C header's names. */
  prefix: string;
}

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
    prefix: 'pwm_table',
  });
  // The field typed last: an error that two fields share (carrier against timer clock) goes there.
  const [lastEdited, setLastEdited] = useState<TimerField>('carrierFrequency');
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
        { minPulseWidth: form.minPulseNs * 1e-9 },
      ),
    [form],
  );
  // Every keystroke is kept as typed (NaN for an empty box or letters), so the table never quietly
  // uses a previous value; the library then refuses it and the message lands on that field.
  const num = (key: TimerField) => (value: number) => {
    setLastEdited(key);
    setForm((current) => ({ ...current, [key]: value }));
  };
  const errors = timerFieldErrors(outcome.error, form, lastEdited);
  const err = (field: TimerField) => errors[field];
  const prefixError = /^[A-Za-z_][A-Za-z0-9_]{0,39}$/.test(form.prefix)
    ? undefined
    : 'Name prefix must be a C identifier of 1 to 40 characters: letters, digits and _, not starting with a digit';
  const table = outcome.table;
  const mf = table ? table.carrierPeriodsPerFundamental : 1;
  const spectra = outcome.effects ? effectSpectra(outcome.effects.combined, mf) : null;
  const stem = `timer-table-${form.method}`;

  return (
    <div>
      <PageHeader
        title="Controller tables"
        subtitle="Compare values for a PWM timer, with dead time and the effect of rounding, dead time and minimum pulse on the spectrum. Check on the real gate drive before full voltage."
      />
      <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
        <Panel title="Timer">
          <form className="flex flex-col gap-3" onSubmit={(e) => e.preventDefault()}>
            <SelectField
              label="Inverter"
              value={form.method}
              onChange={(e) => setForm({ ...form, method: e.target.value as FormState['method'] })}
              options={[
                { value: 'sine-triangle', label: 'Single-phase bridge' },
                { value: 'three-phase', label: 'Three-phase' },
              ]}
            />
            {form.method === 'sine-triangle' ? (
              <SelectField
                label="Scheme"
                value={form.scheme}
                onChange={(e) =>
                  setForm({ ...form, scheme: e.target.value as FormState['scheme'] })
                }
                options={[
                  { value: 'unipolar', label: 'Unipolar (two channels)' },
                  { value: 'bipolar', label: 'Bipolar (one channel)' },
                ]}
              />
            ) : (
              <SelectField
                label="Zero sequence"
                value={form.zeroSequence}
                onChange={(e) =>
                  setForm({ ...form, zeroSequence: e.target.value as FormState['zeroSequence'] })
                }
                options={TIMER_ZERO_SEQUENCE_OPTIONS}
              />
            )}
            <NumberField
              label="Modulation index ma"
              value={form.ma}
              onChange={num('ma')}
              error={err('ma')}
            />
            <NumberField
              label="Fundamental"
              unit="Hz"
              value={form.fundamentalFrequency}
              onChange={num('fundamentalFrequency')}
              error={err('fundamentalFrequency')}
            />
            <NumberField
              label="Carrier"
              unit="Hz"
              value={form.carrierFrequency}
              onChange={num('carrierFrequency')}
              error={err('carrierFrequency')}
              hint="a whole multiple of the fundamental, at least 3 times"
            />
            <NumberField
              label="Timer clock"
              unit="Hz"
              value={form.timerClock}
              onChange={num('timerClock')}
              error={err('timerClock')}
            />
            <SelectField
              label="Counting mode"
              value={form.countingMode}
              onChange={(e) =>
                setForm({ ...form, countingMode: e.target.value as FormState['countingMode'] })
              }
              options={[
                { value: 'centre-aligned', label: 'Centre-aligned (up-down)' },
                { value: 'edge-aligned', label: 'Edge-aligned (up)' },
              ]}
            />
            <NumberField
              label="Counter width"
              unit="bits"
              value={form.counterBits}
              onChange={num('counterBits')}
              error={err('counterBits')}
            />
            <NumberField
              label="Dead time"
              unit="ns"
              value={form.deadTimeNs}
              onChange={num('deadTimeNs')}
              error={err('deadTimeNs')}
            />
            <NumberField
              label="Minimum pulse"
              unit="ns"
              value={form.minPulseNs}
              onChange={num('minPulseNs')}
              error={err('minPulseNs')}
            />
            <NumberField
              label="DC bus"
              unit="V"
              value={form.vdc}
              onChange={num('vdc')}
              error={err('vdc')}
            />
            <TextField
              label="Name prefix"
              value={form.prefix}
              onChange={(e) => setForm({ ...form, prefix: e.target.value })}
              error={prefixError}
              hint="of the C header's arrays and macros (kestrel_drive gives kestrel_drive_a_high, KESTREL_DRIVE_LENGTH)"
              maxLength={60}
            />
          </form>
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
              <Panel
                title="Table"
                actions={
                  <>
                    <Button
                      variant="secondary"
                      onClick={() =>
                        downloadText(
                          timerTableExports(table).json(),
                          `${stem}.json`,
                          'application/json',
                        )
                      }
                    >
                      JSON
                    </Button>
                    <Button
                      variant="secondary"
                      onClick={() =>
                        downloadText(timerTableExports(table).csv(), `${stem}.csv`, 'text/csv')
                      }
                    >
                      CSV
                    </Button>
                    <Button
                      variant="secondary"
                      disabled={prefixError !== undefined}
                      title={prefixError ? 'Correct the name prefix first' : undefined}
                      onClick={() =>
                        downloadText(
                          timerTableExports(table).cHeader(form.prefix),
                          `${form.prefix.toLowerCase()}.h`,
                          'text/x-c',
                        )
                      }
                    >
                      C header
                    </Button>
                  </>
                }
              >
                <p className="mb-2 text-sm">
                  Period register {table.periodRegister} · {table.parameters.tableLength} entries ·
                  carrier realised {formatNumber(table.realisedCarrierFrequency)} Hz · dead time{' '}
                  {table.deadTimeCounts} ticks ({formatNumber(table.realisedDeadTime * 1e9)} ns)
                </p>
                {table.warnings.length ? (
                  <ul className="mb-2 list-disc pl-5 text-sm text-signal">
                    {table.warnings.map((w) => (
                      <li key={w.field + w.message}>{w.message}</li>
                    ))}
                  </ul>
                ) : null}
                <div className="max-h-72 overflow-auto">
                  <table className="num w-full text-xs">
                    <thead className="sticky top-0 bg-panel text-left">
                      <tr>
                        <th scope="col">#</th>
                        <th scope="col">angle (rad)</th>
                        {table.channels.map((c) => (
                          <th key={c.name} scope="col">
                            {c.name}: duty / high / low
                          </th>
                        ))}
                      </tr>
                    </thead>
                    <tbody>
                      {table.entryAngles.slice(0, 400).map((angle, i) => (
                        <tr key={i} className="border-t border-rule/50">
                          <td>{i}</td>
                          <td>{formatNumber(angle)}</td>
                          {table.channels.map((c) => (
                            <td key={c.name}>
                              {formatNumber(c.duty[i] ?? 0, 4)} / {c.highSide[i]} / {c.lowSide[i]}
                            </td>
                          ))}
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
              </Panel>
              <NetlistPanel table={table} fileStem={stem} />
              <DeadTimeCompensationPanel table={table} fileStem={stem} prefix={form.prefix} />
              <Panel title="Effect on the output">
                <p className="text-sm">
                  Fundamental {formatNumber(outcome.effects.combined.referenceFundamental)} →{' '}
                  {formatNumber(outcome.effects.combined.realisedFundamental)} V; THD{' '}
                  {formatPercent(outcome.effects.combined.referenceThd)} →{' '}
                  {formatPercent(outcome.effects.combined.realisedThd)} (rounding, minimum pulse and
                  dead time together).
                </p>
              </Panel>
              {spectra ? (
                <SpectrumChart
                  title="Spectrum: ideal against the table"
                  fileName={`${stem}-spectrum`}
                  fundamentalFrequency={table.realisedFundamentalFrequency}
                  series={[
                    {
                      name: 'Ideal duties',
                      color: 'var(--color-ink)',
                      harmonics: spectra.reference,
                    },
                    {
                      name: 'Realised by the table',
                      color: 'var(--color-signal)',
                      harmonics: spectra.realised,
                    },
                  ]}
                />
              ) : null}
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
