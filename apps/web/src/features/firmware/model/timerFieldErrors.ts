/** The number fields of the controller-table form (times in ns, frequencies in Hz). */
export type TimerField =
  | 'ma'
  | 'fundamentalFrequency'
  | 'carrierFrequency'
  | 'timerClock'
  | 'counterBits'
  | 'deadTimeNs'
  | 'minPulseNs'
  | 'vdc'
  | 'transistorDropV'
  | 'diodeDropV';

/** The form's numbers as typed (NaN for an empty box or letters). */
export type TimerNumbers = Record<TimerField, number>;

/**
 * Each field's message (the number fields, and the counting mode a reduced common-mode table
 * needs), and whether the library's refusal landed on a field.
 */
export type TimerFieldErrors = Partial<Record<TimerField | 'countingMode', string>> & {
  claimed: boolean;
};

const LABELS: Record<TimerField, { label: string; unit: string }> = {
  ma: { label: 'Modulation index ma', unit: '' },
  fundamentalFrequency: { label: 'Fundamental', unit: 'Hz' },
  carrierFrequency: { label: 'Carrier', unit: 'Hz' },
  timerClock: { label: 'Timer clock', unit: 'Hz' },
  counterBits: { label: 'Counter width', unit: 'bits' },
  deadTimeNs: { label: 'Dead time', unit: 'ns' },
  minPulseNs: { label: 'Minimum pulse', unit: 'ns' },
  vdc: { label: 'DC bus', unit: 'V' },
  transistorDropV: { label: 'Transistor on-state drop', unit: 'V' },
  diodeDropV: { label: 'Diode on-state drop', unit: 'V' },
};

/** The library's refusal fields of a single form field. */
const SINGLE: Record<string, TimerField> = {
  'modulation.ma': 'ma',
  fundamentalFrequency: 'fundamentalFrequency',
  timerClock: 'timerClock',
  counterBits: 'counterBits',
  vdc: 'vdc',
  'onStateDrop.transistor': 'transistorDropV',
  'onStateDrop.diode': 'diodeDropV',
};

/** A number as people write it, 9 significant digits: 72,000,000 and 0.5. */
const formatNumber = (value: number, digits = 9) =>
  Number(value.toPrecision(digits)).toLocaleString('en-US', { maximumSignificantDigits: digits });

const entered = (field: TimerField, value: number) =>
  `(entered ${formatNumber(value, 9)}${LABELS[field].unit ? ` ${LABELS[field].unit}` : ''})`;

/** The allowed part of a library message "field must be <allowed>; got <value>". */
function allowedOf(message: string): string {
  const start = message.indexOf(' must be ');
  const end = message.lastIndexOf('; got ');
  return start >= 0 ? message.slice(start + 9, end > start ? end : undefined) : message;
}

/** Of the fields an error concerns, the one typed last (else the first listed). */
function pick(fields: readonly TimerField[], lastEdited: TimerField): TimerField {
  return fields.includes(lastEdited) ? lastEdited : (fields[0] as TimerField);
}

/**
 * The controller-table form's messages, each on the field it concerns, in that field's unit and
 * quoting what was typed: an empty or non-numeric box asks for a number; the library's refusal
 * (`timerTable` and `firmwareEffects`, whose rules these are) is put on its field, and a refusal
 * two fields share (a carrier above half the timer clock, a carrier period the counter cannot
 * hold, a carrier that is not a whole multiple of the fundamental) on the one typed last. Dead
 * time and minimum pulse are in ns, as their fields are (the library works in seconds).
 */
export function timerFieldErrors(
  error: { field: string; message: string } | null,
  form: TimerNumbers,
  lastEdited: TimerField,
): TimerFieldErrors {
  const result: TimerFieldErrors = { claimed: false };
  for (const field of Object.keys(LABELS) as TimerField[]) {
    if (Number.isNaN(form[field])) {
      const { label, unit } = LABELS[field];
      result[field] = `Enter a number: ${label}${unit ? ` in ${unit}` : ''}`;
      result.claimed = true;
    }
  }
  if (!error || result.claimed) return result;
  const put = (field: TimerField, message: string) => {
    result[field] = message;
    result.claimed = true;
  };
  const carrier = form.carrierFrequency;
  const clock = form.timerClock;
  const single = SINGLE[error.field];
  if (single) {
    put(
      single,
      `${LABELS[single].label} must be ${allowedOf(error.message)} ${entered(single, form[single])}`,
    );
  } else if (error.field === 'carrierFrequency') {
    if (!(carrier > 0))
      put('carrierFrequency', `Carrier must be above 0 Hz ${entered('carrierFrequency', carrier)}`);
    else if (pick(['carrierFrequency', 'timerClock'], lastEdited) === 'timerClock')
      put(
        'timerClock',
        `Timer clock must be at least twice the carrier, ${formatNumber(2 * carrier, 9)} Hz ${entered('timerClock', clock)}`,
      );
    else
      put(
        'carrierFrequency',
        `Carrier must be at most half the timer clock, ${formatNumber(clock / 2, 9)} Hz ${entered('carrierFrequency', carrier)}`,
      );
  } else if (error.field === 'carrierFrequency/fundamentalFrequency') {
    const field = pick(['carrierFrequency', 'fundamentalFrequency'], lastEdited);
    put(
      field,
      field === 'carrierFrequency'
        ? `Carrier must be a whole multiple, at least 3 times, of the fundamental, ${formatNumber(form.fundamentalFrequency, 9)} Hz ${entered(field, carrier)}`
        : `Fundamental must go a whole number of times, at least 3, into the carrier, ${formatNumber(carrier, 9)} Hz ${entered(field, form.fundamentalFrequency)}`,
    );
  } else if (error.field.startsWith('timerClock/')) {
    // The carrier period in timer counts does not fit the counter: clock, carrier or width.
    const field = pick(['timerClock', 'carrierFrequency', 'counterBits'], lastEdited);
    put(
      field,
      `${LABELS[field].label}: the carrier period in timer counts must be ${allowedOf(error.message)} ${entered(field, form[field])}`,
    );
  } else if (error.field === 'deadTime') {
    put(
      'deadTimeNs',
      form.deadTimeNs < 0
        ? `Dead time must be at least 0 ns ${entered('deadTimeNs', form.deadTimeNs)}`
        : `Dead time must be below half the carrier period, ${formatNumber(1e9 / (2 * carrier), 9)} ns ${entered('deadTimeNs', form.deadTimeNs)}`,
    );
  } else if (error.field === 'countingMode') {
    // azspwm1 and nspwm need an up-down counter (their compare sense changes each half period).
    result.countingMode = `Counting mode must be ${allowedOf(error.message)}`;
    result.claimed = true;
  } else if (error.field === 'minPulseWidth') {
    put(
      'minPulseNs',
      form.minPulseNs < 0
        ? `Minimum pulse must be at least 0 ns ${entered('minPulseNs', form.minPulseNs)}`
        : `Minimum pulse must be at most the carrier period, ${formatNumber(1e9 / carrier, 9)} ns ${entered('minPulseNs', form.minPulseNs)}`,
    );
  }
  return result;
}
