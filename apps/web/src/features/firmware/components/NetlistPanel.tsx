import { useState } from 'react';
import type { TimerTable } from '@pulsewright/modulation';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { downloadText } from '../../../lib/download';
import { netlistOf } from '../model/timerTables';

/** The netlist's options as typed, in the units shown (nanoseconds, volts, whole periods). */
interface NetlistForm {
  riseTimeNs: number;
  fallTimeNs: number;
  periods: number;
  gateVoltage: number;
}

/** The fields: the form's key, the library's option it sets, the label and the unit shown. */
const FIELDS: readonly { key: keyof NetlistForm; field: string; label: string; unit?: string }[] = [
  { key: 'riseTimeNs', field: 'riseTime', label: 'Rise time', unit: 'ns' },
  { key: 'fallTimeNs', field: 'fallTime', label: 'Fall time', unit: 'ns' },
  { key: 'periods', field: 'periods', label: 'Fundamental periods' },
  { key: 'gateVoltage', field: 'gateVoltage', label: 'Gate level', unit: 'V' },
];

/**
 * A download of the table's switching pattern as a SPICE netlist: one piecewise-linear source per
 * switch's gate and per leg's voltage, each edge a ramp of the chosen rise or fall time, with the
 * table's dead time, over the chosen number of fundamental periods, and the page's device
 * on-state drops in the leg voltages when given. The library writes it; an option it refuses is
 * shown on its field in the library's words.
 */
export function NetlistPanel({
  table,
  fileStem,
  onStateDrop,
}: {
  table: TimerTable;
  fileStem: string;
  /** Device on-state drops, volts; left out for ideal switches. */
  onStateDrop?: { transistor: number; diode: number } | undefined;
}) {
  const [form, setForm] = useState<NetlistForm>({
    riseTimeNs: 100,
    fallTimeNs: 100,
    periods: 1,
    gateVoltage: 15,
  });
  const [error, setError] = useState<{ field: string; message: string } | null>(null);
  const num = (key: keyof NetlistForm) => (e: React.ChangeEvent<HTMLInputElement>) => {
    const value = Number(e.target.value);
    if (e.target.value !== '' && Number.isFinite(value)) setForm({ ...form, [key]: value });
    setError(null);
  };
  const errorOf = (field: string) => (error?.field === field ? error.message : undefined);
  const download = () => {
    const outcome = netlistOf(table, {
      // Divided rather than multiplied by 1e-9, so 50 ns is the double nearest 5e-8 s.
      riseTime: form.riseTimeNs / 1e9,
      fallTime: form.fallTimeNs / 1e9,
      periods: form.periods,
      gateVoltage: form.gateVoltage,
      ...(onStateDrop === undefined ? {} : { onStateDrop }),
    });
    setError(outcome.error);
    if (outcome.text !== null) downloadText(outcome.text, `${fileStem}.cir`, 'text/plain');
  };
  return (
    <Panel
      title="Circuit-simulation netlist"
      actions={
        <Button variant="secondary" onClick={download}>
          SPICE netlist
        </Button>
      }
    >
      <p className="mb-2 text-sm">
        Piecewise-linear sources for each switch's gate (0 V off) and each leg's voltage to the DC
        midpoint, with this table's dead time
        {onStateDrop
          ? ` and the devices' on-state drops (${onStateDrop.transistor} V transistor, ${onStateDrop.diode} V diode) in the leg voltages. Idealised otherwise`
          : '. Idealised switches'}
        : check the real gate drive and protection before applying the DC bus.
      </p>
      <form className="grid grid-cols-2 gap-3 sm:grid-cols-4" onSubmit={(e) => e.preventDefault()}>
        {FIELDS.map(({ key, field, label, unit }) => (
          <TextField
            key={key}
            label={label}
            unit={unit}
            type="number"
            defaultValue={form[key]}
            onChange={num(key)}
            error={errorOf(field)}
          />
        ))}
      </form>
    </Panel>
  );
}
