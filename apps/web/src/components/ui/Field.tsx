import {
  useId,
  useState,
  type InputHTMLAttributes,
  type ReactNode,
  type SelectHTMLAttributes,
} from 'react';

interface FieldShellProps {
  id: string;
  label: string;
  unit?: string | undefined;
  hint?: string | undefined;
  error?: string | undefined;
  children: ReactNode;
}

function FieldShell({ id, label, unit, hint, error, children }: FieldShellProps) {
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium tracking-wide text-ink-soft uppercase">
        {label}
        {unit ? <span className="ml-1 normal-case text-ink-soft/80">({unit})</span> : null}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-xs text-ink-soft">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-xs font-medium text-bad">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** The id of the text that describes a field: its error when it has one, else its hint. */
function describedBy(id: string, error: string | undefined, hint: string | undefined) {
  return error ? `${id}-error` : hint ? `${id}-hint` : undefined;
}

const inputClass =
  'rounded-md border bg-panel px-2 py-1.5 text-sm text-ink shadow-inner disabled:bg-paper disabled:text-ink-soft aria-[invalid=true]:border-bad border-rule';

export interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: string;
  unit?: string | undefined;
  hint?: string | undefined;
  error?: string | undefined;
}

export function TextField({ label, unit, hint, error, className = '', ...rest }: TextFieldProps) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} unit={unit} hint={hint} error={error}>
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, error, hint)}
        className={`${inputClass} ${className}`}
        {...rest}
      />
    </FieldShell>
  );
}

/** One choice of a {@link SelectField}: the value it stands for and the words shown. */
export interface FieldOption<T extends string> {
  value: T;
  label: string;
  disabled?: boolean;
}

/** The typed value of the option whose value is `text` (a select's `event.target.value`), if any. */
export function optionValue<T extends string>(
  options: readonly FieldOption<T>[],
  text: string,
): T | undefined {
  return options.find((option) => option.value === text)?.value;
}

export interface SelectFieldProps<T extends string> extends Omit<
  SelectHTMLAttributes<HTMLSelectElement>,
  'id' | 'value'
> {
  label: string;
  hint?: string | undefined;
  error?: string | undefined;
  options: readonly FieldOption<T>[];
  value?: T;
  /** The chosen option's value, typed as the options are (no cast at the caller). */
  onValueChange?: (value: T) => void;
}

/** A labelled drop-down of typed options; `onValueChange` reports the chosen option's value. */
export function SelectField<T extends string>({
  label,
  hint,
  error,
  options,
  onValueChange,
  onChange,
  className = '',
  ...rest
}: SelectFieldProps<T>) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, error, hint)}
        className={`${inputClass} w-full min-w-0 ${className}`}
        onChange={(event) => {
          onChange?.(event);
          const chosen = optionValue(options, event.target.value);
          if (chosen !== undefined) onValueChange?.(chosen);
        }}
        {...rest}
      >
        {options.map((option) => (
          <option key={option.value} value={option.value} disabled={option.disabled}>
            {option.label}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}

/** The number a field's text stands for: NaN for empty or non-numeric text (the caller's validator names it). */
export function parseNumberText(text: string): number {
  const trimmed = text.trim();
  return trimmed === '' ? Number.NaN : Number(trimmed);
}

/** The text of a number in a field: up to 12 significant digits, empty for NaN. */
export function numberText(value: number): string {
  return Number.isFinite(value) ? String(Number(value.toPrecision(12))) : '';
}

/** The numbers of a list typed with commas or spaces ("5, 7 11"); an entry that is not a number is NaN. */
export function parseNumberList(text: string): number[] {
  return text
    .split(/[\s,]+/)
    .filter(Boolean)
    .map(parseNumberText);
}

/** The text of a list of numbers in a field ("5, 7, 11"). */
export function numberListText(values: readonly number[]): string {
  return values.map(numberText).join(', ');
}

/**
 * The text of a box that reports every keystroke: the box shows exactly what was typed,
 * `onChange` gets what it parses to (with the validator's message for it), and the text
 * follows `value` only when the value changes from elsewhere (a slider, a reload) to one the
 * text does not already stand for.
 */
function useFieldText<T>(
  value: T,
  format: (value: T) => string,
  parse: (text: string) => T,
  onChange: (value: T) => void,
) {
  const [text, setText] = useState(() => format(value));
  // Compared through `format`, so a list rebuilt on every render or a NaN is the same value.
  const [seen, setSeen] = useState(() => format(value));
  if (seen !== format(value)) {
    setSeen(format(value));
    if (format(parse(text)) !== format(value)) setText(format(value));
  }
  return {
    text,
    change: (next: string) => {
      setText(next);
      onChange(parse(next));
    },
  };
}

export interface ParsedFieldProps<T> extends Omit<
  InputHTMLAttributes<HTMLInputElement>,
  'id' | 'value' | 'onChange' | 'type'
> {
  label: string;
  unit?: string | undefined;
  hint?: string | undefined;
  /** An error from elsewhere (the service, the library's report); the validator's message comes first. */
  error?: string | undefined;
  /** The value the field stands for, in the caller's type. */
  value: T;
  /** The text shown for a value (when the field starts and when the value changes from elsewhere). */
  format: (value: T) => string;
  /** What a text stands for; it never throws (a number field gives NaN for letters). */
  parse: (text: string) => T;
  /** The message for a value that cannot be used (naming the field and its range), or undefined. */
  validate?: ((value: T) => string | undefined) | undefined;
  /** Called on every keystroke with the parsed value and the validator's message for it. */
  onChange: (value: T, error: string | undefined) => void;
}

/**
 * A text box for a typed value: it shows exactly the text typed (never a coerced or remembered
 * value), parses it on every keystroke, validates it with `validate` and shows that message on
 * the field, and reports both to the caller, which can then refuse to save.
 */
export function ParsedField<T>({
  label,
  unit,
  hint,
  error,
  value,
  format,
  parse,
  validate,
  onChange,
  className = '',
  inputMode = 'text',
  ...rest
}: ParsedFieldProps<T>) {
  const id = useId();
  const { text, change } = useFieldText(value, format, parse, (next) =>
    onChange(next, validate?.(next)),
  );
  const shown = validate?.(parse(text)) ?? error;
  return (
    <FieldShell id={id} label={label} unit={unit} hint={hint} error={shown}>
      <input
        id={id}
        type="text"
        inputMode={inputMode}
        autoComplete="off"
        spellCheck={false}
        value={text}
        onChange={(event) => change(event.target.value)}
        aria-invalid={shown ? true : undefined}
        aria-describedby={describedBy(id, shown, hint)}
        className={`${inputClass} num ${className}`}
        {...rest}
      />
    </FieldShell>
  );
}

export interface NumberFieldProps extends Omit<
  ParsedFieldProps<number>,
  'format' | 'parse' | 'inputMode'
> {
  /** Shown = value·scale (1e3 shows henries as mH); `validate` and `onChange` get the value. @default 1 */
  scale?: number;
}

/** A number box that shows exactly what was typed and reports it while typing (NaN when it is not a number). */
export function NumberField({ scale = 1, ...rest }: NumberFieldProps) {
  return (
    <ParsedField<number>
      {...rest}
      inputMode="decimal"
      format={(value) => numberText(value * scale)}
      parse={(text) => parseNumberText(text) / scale}
    />
  );
}

export interface SliderFieldProps {
  label: string;
  unit?: string;
  value: number;
  min: number;
  max: number;
  step: number;
  hint?: string;
  error?: string | undefined;
  disabled?: boolean;
  onChange: (value: number) => void;
}

/** A number box and a slider bound to one value; both labelled, both keyboard-operable; the box reports while typing. */
export function SliderField({
  label,
  unit,
  value,
  min,
  max,
  step,
  hint,
  error,
  disabled,
  onChange,
}: SliderFieldProps) {
  const id = useId();
  const { text, change } = useFieldText(value, numberText, parseNumberText, onChange);
  return (
    <FieldShell id={id} label={label} unit={unit} hint={hint ?? `${min} to ${max}`} error={error}>
      <div className="flex items-center gap-2">
        <input
          type="range"
          aria-label={`${label} slider`}
          min={min}
          max={max}
          step={step}
          value={Number.isFinite(value) ? Math.min(max, Math.max(min, value)) : min}
          disabled={disabled}
          onChange={(event) => onChange(Number(event.target.value))}
          className="min-w-0 flex-1 accent-signal"
        />
        <input
          id={id}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          value={text}
          disabled={disabled}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(id, error, `${min} to ${max}`)}
          onChange={(event) => change(event.target.value)}
          className={`${inputClass} num w-24`}
        />
      </div>
    </FieldShell>
  );
}
