// One labelled text field of a tool's form, with its hint and, when the input is bad, the error and an example.
import { useId, type ReactElement } from 'react';
import type { InputError } from '@/lib/values/result';

export interface FieldProps {
  name: string;
  label: string;
  value: string;
  onChange: (value: string) => void;
  /** What to type, with "e.g." examples; there is no placeholder, since greyed text in a field reads as a value typed. */
  hint?: string;
  error?: InputError | undefined;
  optional?: boolean;
  /** Values and codes are set in the monospace so 2k2 and 22k never blur together. */
  mono?: boolean;
}

export function Field({ name, label, value, onChange, hint, error, optional, mono = true }: FieldProps): ReactElement {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : '', error ? errorId : ''].filter((x) => x !== '').join(' ');
  return (
    <div className="tool-field">
      <label htmlFor={id} className="block font-semibold">
        {label}
        {optional && <span className="font-normal text-ink-soft"> (optional)</span>}
      </label>
      {hint && (
        <p id={hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      )}
      <input
        id={id}
        name={name}
        type="text"
        inputMode="text"
        autoComplete="off"
        spellCheck={false}
        className={`input mt-1 ${mono ? 'value' : ''} ${error ? 'border-brick' : ''}`}
        value={value}
        onChange={(event) => onChange(event.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy === '' ? undefined : describedBy}
      />
      {error && <FieldError id={errorId} error={error} />}
    </div>
  );
}

export function FieldError({ id, error }: { id?: string; error: InputError }): ReactElement {
  return (
    <p id={id} className="tool-error mt-1 text-sm text-brick">
      {error.message} <span className="whitespace-nowrap">For example:</span> <span className="value">{error.example}</span>
    </p>
  );
}

export interface SelectFieldProps {
  name: string;
  label: string;
  value: string;
  options: ReadonlyArray<{ value: string; label: string }>;
  onChange: (value: string) => void;
  error?: InputError | undefined;
}

export function SelectField({ name, label, value, options, onChange, error }: SelectFieldProps): ReactElement {
  const id = useId();
  return (
    <div className="tool-field">
      <label htmlFor={id} className="block font-semibold">
        {label}
      </label>
      <select
        id={id}
        name={name}
        className="input mt-1"
        value={value}
        onChange={(event) => onChange(event.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      {error && <FieldError id={`${id}-error`} error={error} />}
    </div>
  );
}
