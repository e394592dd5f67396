import { useMemo, useState } from 'react';
import { SpectrumChart } from '../../../components/charts/SpectrumChart';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState } from '../../../components/ui/QueryState';
import { downloadText } from '../../../lib/download';
import { formatNumber, formatPercent } from '../../../lib/format';
import { buildTimerTable, effectSpectra, timerTableExports } from '../api/timerTables';
import { NetlistPanel } from './NetlistPanel';
import { PatternTablePanel } from './PatternTablePanel';

interface FormState {
  method: 'sine-triangle' | 'three-phase';
  scheme: 'bipolar' | 'unipolar';
  zeroSequence: 'none' | 'third-harmonic' | 'min-max';
  ma: number;
  fundamentalFrequency: number;
  carrierFrequency: number;
  timerClock: number;
  countingMode: 'centre-aligned' | 'edge-aligned';
  counterBits: number;
  deadTimeNs: number;
  minPulseNs: number;
  vdc: number;
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
  });
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
  const num = (key: keyof FormState) => (e: React.ChangeEvent<HTMLInputElement>) => {
    const value = Number(e.target.value);
    if (e.target.value !== '' && Number.isFinite(value)) setForm({ ...form, [key]: value });
  };
  const err = (field: string) =>
    outcome.error && outcome.error.field.startsWith(field) ? outcome.error.message : undefined;
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
                options={[
                  { value: 'none', label: 'None' },
                  { value: 'third-harmonic', label: 'Third harmonic' },
                  { value: 'min-max', label: 'Min-max' },
                ]}
              />
            )}
            <TextField
              label="Modulation index ma"
              type="number"
              step={0.01}
              defaultValue={form.ma}
              onChange={num('ma')}
              error={err('ma') ?? err('modulation')}
            />
            <TextField
              label="Fundamental"
              unit="Hz"
              type="number"
              defaultValue={form.fundamentalFrequency}
              onChange={num('fundamentalFrequency')}
              error={err('fundamentalFrequency')}
            />
            <TextField
              label="Carrier"
              unit="Hz"
              type="number"
              defaultValue={form.carrierFrequency}
              onChange={num('carrierFrequency')}
              error={err('carrierFrequency')}
              hint="a whole multiple of the fundamental"
            />
            <TextField
              label="Timer clock"
              unit="Hz"
              type="number"
              defaultValue={form.timerClock}
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
            <TextField
              label="Counter width"
              unit="bits"
              type="number"
              defaultValue={form.counterBits}
              onChange={num('counterBits')}
              error={err('counterBits')}
            />
            <TextField
              label="Dead time"
              unit="ns"
              type="number"
              defaultValue={form.deadTimeNs}
              onChange={num('deadTimeNs')}
              error={err('deadTime')}
            />
            <TextField
              label="Minimum pulse"
              unit="ns"
              type="number"
              defaultValue={form.minPulseNs}
              onChange={num('minPulseNs')}
              error={err('minPulseWidth')}
            />
            <TextField
              label="DC bus"
              unit="V"
              type="number"
              defaultValue={form.vdc}
              onChange={num('vdc')}
              error={err('vdc')}
            />
          </form>
        </Panel>
        <div className="flex min-w-0 flex-col gap-4">
          {outcome.error ? <ErrorState error={new Error(outcome.error.message)} /> : null}
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
                      onClick={() =>
                        downloadText(timerTableExports(table).cHeader(), `${stem}.h`, 'text/x-c')
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
