import { assertNumberInRange, type NumberBounds } from '@pulsewright/modulation';

/** How a form shows a number the library holds in SI units: shown = value·scale, in `unit`. */
export interface FieldUnit {
  /** Shown = value·scale (1e3 shows henries as mH, 1e9 seconds as ns). @default 1 */
  scale?: number;
  /** The unit the field shows ('V', 'mH', 'µF', 'ns', …); empty for a ratio. @default '' */
  unit?: string;
}

/** A bound as people write it: 100,000 and 0.000001, six significant digits at most. */
function formatBound(value: number): string {
  return value.toLocaleString('en-US', { maximumSignificantDigits: 6 });
}

/**
 * The allowed range of a field in the unit it shows, one phrase: "above 0 to 100,000 V",
 * "from 1 to 1,000", "a whole number from 2 to 400". The bounds are the library's (SI), scaled.
 */
export function rangeText(bounds: NumberBounds, { scale = 1, unit = '' }: FieldUnit = {}): string {
  const suffix = unit ? ` ${unit}` : '';
  const kind = bounds.integer ? 'a whole number ' : '';
  const { min, max } = bounds;
  const low =
    min === undefined
      ? ''
      : `${bounds.minExclusive ? 'above' : 'from'} ${formatBound(min * scale)}`;
  const high =
    max === undefined ? '' : `${bounds.maxExclusive ? 'below' : 'to'} ${formatBound(max * scale)}`;
  if (low && high) return `${kind}${low} ${high}${suffix}`;
  if (low) return `${kind}${low.replace(/^from/, 'at least')}${suffix}`;
  if (high) return `${kind}${high.replace(/^to/, 'at most')}${suffix}`;
  return `${kind || 'a number'}`.trim();
}

/** The number as it was entered, in the field's unit (12 significant digits drop binary rounding). */
function enteredText(value: number, { scale = 1, unit = '' }: FieldUnit): string {
  const shown = Number((value * scale).toPrecision(12));
  const magnitude = Math.abs(shown);
  // Very large or small entries keep the exponent form they were most likely typed in.
  const text =
    magnitude !== 0 && (magnitude >= 1e9 || magnitude < 1e-6 || !Number.isFinite(shown))
      ? String(shown)
      : shown.toLocaleString('en-US', { maximumSignificantDigits: 12 });
  return `${text}${unit ? ` ${unit}` : ''}`;
}

/**
 * The message for a number field whose value the library's bounds refuse, in the field's unit and
 * quoting what was entered, or undefined when the value is allowed. The check is the library's
 * own (`assertNumberInRange`); only the words are the form's, so the field, the unit and one
 * range appear together: "DC bus must be above 0 to 100,000 V (entered 1e+308 V)". NaN stands
 * for an empty box or text that is not a number.
 */
export function rangeError(
  label: string,
  value: number,
  bounds: NumberBounds,
  unit: FieldUnit = {},
): string | undefined {
  try {
    assertNumberInRange(label, value, bounds);
    return undefined;
  } catch {
    const range = rangeText(bounds, unit);
    if (Number.isNaN(value)) return `Enter a number: ${label} is ${range}`;
    return `${label} must be ${range} (entered ${enteredText(value, unit)})`;
  }
}
