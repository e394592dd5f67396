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
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`${inputClass} ${className}`}
        {...rest}
      />
    </FieldShell>
  );
}

export interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> {
  label: string;
  hint?: string | undefined;
  error?: string | undefined;
  options: readonly { value: string; label: string; disabled?: boolean }[];
}

export function SelectField({
  label,
  hint,
  error,
  options,
  className = '',
  ...rest
}: SelectFieldProps) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`${inputClass} w-full min-w-0 ${className}`}
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

function numberText(value: number): string {
  return Number.isFinite(value) ? String(Number(value.toPrecision(12))) : '';
}

/**
 * The text of a number box that reports every keystroke: the box shows exactly what was typed,
 * `onChange` gets its number (NaN while it is empty or not a number) divided by `scale`, and the
 * text follows `value` only when the value changes from elsewhere (a slider, a reload).
 */
function useNumberText(value: number, scale: number, onChange: (value: number) => void) {
  const [text, setText] = useState(() => numberText(value * scale));
  const [seen, setSeen] = useState(value);
  if (!Object.is(seen, value)) {
    setSeen(value);
    if (!Object.is(parseNumberText(text) / scale, value)) setText(numberText(value * scale));
  }
  return {
    text,
    change: (next: string) => {
      setText(next);
      onChange(parseNumberText(next) / scale);
    },
  };
}

export interface NumberFieldProps extends Omit<
  InputHTMLAttributes<HTMLInputElement>,
  'id' | 'value' | 'onChange' | 'type'
> {
  label: string;
  unit?: string | undefined;
  hint?: string | undefined;
  error?: string | undefined;
  /** The value in the caller's unit. */
  value: number;
  /** Shown = value·scale (1e3 shows henries as mH). @default 1 */
  scale?: number;
  onChange: (value: number) => void;
}

/** A number box that shows exactly what was typed and reports it while typing (NaN when it is not a number). */
export function NumberField({
  label,
  unit,
  hint,
  error,
  value,
  scale = 1,
  onChange,
  className = '',
  ...rest
}: NumberFieldProps) {
  const id = useId();
  const { text, change } = useNumberText(value, scale, onChange);
  return (
    <FieldShell id={id} label={label} unit={unit} hint={hint} error={error}>
      <input
        id={id}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        spellCheck={false}
        value={text}
        onChange={(event) => change(event.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`${inputClass} num ${className}`}
        {...rest}
      />
    </FieldShell>
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
  const { text, change } = useNumberText(value, 1, onChange);
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
          aria-describedby={error ? `${id}-error` : `${id}-hint`}
          onChange={(event) => change(event.target.value)}
          className={`${inputClass} num w-24`}
        />
      </div>
    </FieldShell>
  );
}
