// One labelled form field with its hint and its error message, wired together for screen readers.
import type { ReactNode } from 'react';

export interface FieldA11y {
  id: string;
  'aria-describedby': string;
  'aria-invalid': true | undefined;
}

interface FieldProps {
  /** The wrapper's id (what error links point at); the control gets `${id}-input`. */
  id: string;
  label: string;
  hint?: string;
  error?: string | undefined;
  children: (a11y: FieldA11y) => ReactNode;
}

export function Field({ id, label, hint, error, children }: FieldProps) {
  const inputId = `${id}-input`;
  return (
    <div id={id} className="grid gap-1 font-sans">
      <label htmlFor={inputId} className="font-semibold">
        {label}
      </label>
      {hint && (
        <p id={`${id}-hint`} className="text-sm text-ink-soft">
          {hint}
        </p>
      )}
      {children({ id: inputId, 'aria-describedby': `${hint ? `${id}-hint ` : ''}${id}-error`, 'aria-invalid': error ? true : undefined })}
      <p id={`${id}-error`} className="text-sm text-brick empty:hidden">
        {error}
      </p>
    </div>
  );
}
