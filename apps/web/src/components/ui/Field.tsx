import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';

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
    <div className="flex flex-col gap-1">
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
  options: readonly { value: string; label: string }[];
}

export function SelectField({ label, hint, error, options, className = '', ...rest }: SelectFieldProps) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} hint={hint} error={error}>
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`${inputClass} ${className}`}
        {...rest}
      >
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
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

/** A number box and a slider bound to one value; both labelled, both keyboard-operable. */
export function SliderField({ label, unit, value, min, max, step, hint, error, disabled, onChange }: SliderFieldProps) {
  const id = useId();
  const parse = (text: string) => {
    const number = Number(text);
    if (text.trim() !== '' && Number.isFinite(number)) onChange(number);
  };
  return (
    <FieldShell id={id} label={label} unit={unit} hint={hint ?? `${min} to ${max}`} error={error}>
      <div className="flex items-center gap-2">
        <input
          type="range"
          aria-label={`${label} slider`}
          min={min}
          max={max}
          step={step}
          value={Math.min(max, Math.max(min, value))}
          disabled={disabled}
          onChange={(event) => onChange(Number(event.target.value))}
          className="min-w-0 flex-1 accent-signal"
        />
        <input
          id={id}
          type="number"
          inputMode="decimal"
          step={step}
          defaultValue={value}
          key={value}
          disabled={disabled}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : `${id}-hint`}
          onBlur={(event) => parse(event.target.value)}
          onKeyDown={(event) => {
            if (event.key === 'Enter') parse((event.target as HTMLInputElement).value);
          }}
          className={`${inputClass} num w-24`}
        />
      </div>
    </FieldShell>
  );
}
