import { describe, expect, it } from 'vitest';
import { buildTimerTable } from './timerTables';
import { timerFieldErrors, type TimerField, type TimerNumbers } from './timerFieldErrors';

const base: TimerNumbers = {
  ma: 0.85,
  fundamentalFrequency: 50,
  carrierFrequency: 10_000,
  timerClock: 72e6,
  counterBits: 16,
  deadTimeNs: 500,
  minPulseNs: 0,
  vdc: 360,
  transistorDropV: 0,
  diodeDropV: 0,
};

/** The library's refusal of the form's numbers (as the page builds the table), placed on fields. */
function errorsOf(form: TimerNumbers, lastEdited: TimerField) {
  const outcome = buildTimerTable(
    {
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: form.ma },
      fundamentalFrequency: form.fundamentalFrequency,
      carrierFrequency: form.carrierFrequency,
      timerClock: form.timerClock,
      countingMode: 'centre-aligned',
      counterBits: form.counterBits,
      deadTime: form.deadTimeNs * 1e-9,
      vdc: form.vdc,
    },
    {
      minPulseWidth: form.minPulseNs * 1e-9,
      onStateDrop: { transistor: form.transistorDropV, diode: form.diodeDropV },
    },
  );
  return timerFieldErrors(outcome.error, form, lastEdited);
}

// Issue 10: a 1 kHz timer clock marked the carrier field, and the dead time (a field in ns) was
// refused in seconds. The rules are the library's; these check where and in what unit they land.
describe('timerFieldErrors', () => {
  it('puts a timer clock too slow for the carrier on the timer clock when it was typed last', () => {
    const errors = errorsOf({ ...base, timerClock: 1000 }, 'timerClock');
    expect(errors.timerClock).toBe(
      'Timer clock must be at least twice the carrier, 20,000 Hz (entered 1,000 Hz)',
    );
    expect(errors.carrierFrequency).toBeUndefined();
    // Typed in the carrier instead: the carrier field says it.
    expect(errorsOf({ ...base, timerClock: 1000 }, 'carrierFrequency').carrierFrequency).toBe(
      'Carrier must be at most half the timer clock, 500 Hz (entered 10,000 Hz)',
    );
  });

  it('refuses a dead time of half the carrier period or more in ns, as the field is', () => {
    // 10 kHz carrier: period 100 µs, half 50,000 ns.
    const errors = errorsOf({ ...base, deadTimeNs: 60_000 }, 'deadTimeNs');
    expect(errors.deadTimeNs).toBe(
      'Dead time must be below half the carrier period, 50,000 ns (entered 60,000 ns)',
    );
    expect(errorsOf({ ...base, deadTimeNs: -5 }, 'deadTimeNs').deadTimeNs).toBe(
      'Dead time must be at least 0 ns (entered -5 ns)',
    );
  });

  it('asks for a number in an emptied box and keeps the table from using an old value', () => {
    const errors = errorsOf({ ...base, vdc: Number.NaN }, 'vdc');
    expect(errors.vdc).toBe('Enter a number: DC bus in V');
    expect(errors.claimed).toBe(true);
  });

  it('puts a refused on-state drop on its field, in volts', () => {
    const errors = errorsOf({ ...base, diodeDropV: -1 }, 'diodeDropV');
    expect(errors.diodeDropV).toMatch(/^Diode on-state drop must be .*0.* \(entered -1 V\)$/);
    expect(errors.transistorDropV).toBeUndefined();
    expect(errors.claimed).toBe(true);
  });

  it('has nothing to say about a table the library builds', () => {
    expect(errorsOf(base, 'ma')).toEqual({ claimed: false });
  });
});

describe('the counting mode of a reduced common-mode table', () => {
  it('puts the refusal of edge-aligned counting for azspwm1 on the counting mode (Hava and Ün 2009: the sense changes each half period)', () => {
    const outcome = buildTimerTable(
      {
        modulation: { method: 'three-phase', zeroSequence: 'azspwm1', ma: 0.85 },
        fundamentalFrequency: 50,
        carrierFrequency: 10_000,
        timerClock: 72e6,
        countingMode: 'edge-aligned',
      },
      { minPulseWidth: 0 },
    );
    const errors = timerFieldErrors(outcome.error, base, 'ma');
    expect(errors.claimed).toBe(true);
    expect(errors.countingMode).toMatch(
      /^Counting mode must be 'centre-aligned' for zeroSequence 'azspwm1'/,
    );
  });
});
