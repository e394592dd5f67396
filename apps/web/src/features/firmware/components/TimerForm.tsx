import type { Dispatch, SetStateAction } from 'react';
import { NumberField, SelectField, TextField } from '../../../components/ui/Field';
import { TIMER_ZERO_SEQUENCE_OPTIONS } from '../../../lib/modulationOptions';
import type { TimerFormState as FormState } from '../model/timerForm';
import type { TimerField, TimerFieldErrors } from '../model/timerFieldErrors';

/**
 * The controller-tables form: inverter, scheme or zero sequence, ma, fundamental and carrier (Hz),
 * timer clock (Hz), counting mode, counter width (bits), dead time and minimum pulse (ns), DC bus
 * (V), the devices' on-state drops (V) and the C header's name prefix, each with the library's
 * message for it.
 */
export function TimerForm({
  form,
  setForm,
  num,
  errors,
  prefixError,
}: {
  form: FormState;
  setForm: Dispatch<SetStateAction<FormState>>;
  /** Keeps a number field as typed and notes it as the field typed last. */
  num: (key: TimerField) => (value: number) => void;
  errors: TimerFieldErrors;
  prefixError: string | undefined;
}) {
  const err = (field: TimerField) => errors[field];
  return (
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
          onChange={(e) => setForm({ ...form, scheme: e.target.value as FormState['scheme'] })}
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
        error={errors.countingMode}
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
      <NumberField
        label="Transistor on-state drop"
        unit="V"
        value={form.transistorDropV}
        onChange={num('transistorDropV')}
        error={err('transistorDropV')}
        hint="with the diode's: the drops' effect on the output (0 and 0: ideal switches)"
      />
      <NumberField
        label="Diode on-state drop"
        unit="V"
        value={form.diodeDropV}
        onChange={num('diodeDropV')}
        error={err('diodeDropV')}
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
  );
}
