// A small form that opens under the toolbar (insert a link, a reading, a caution, a picture); Escape closes it.
import { useEffect, useId, useRef, type FormEvent, type ReactNode } from 'react';

interface PanelProps {
  title: string;
  submitLabel: string;
  onSubmit: () => void;
  onClose: () => void;
  error?: string | null;
  children: ReactNode;
}

export function Panel({ title, submitLabel, onSubmit, onClose, error, children }: PanelProps) {
  const titleId = useId();
  const ref = useRef<HTMLFormElement>(null);
  useEffect(() => {
    ref.current?.querySelector<HTMLElement>('input, select, textarea')?.focus();
  }, []);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    event.stopPropagation();
    onSubmit();
  };
  return (
    <form
      ref={ref}
      role="group"
      aria-labelledby={titleId}
      onSubmit={submit}
      onKeyDown={(event) => {
        if (event.key === 'Escape') {
          event.preventDefault();
          onClose();
        }
      }}
      className="panel m-2 grid gap-2 border border-rule-strong bg-paper p-3 font-sans text-sm"
    >
      <p id={titleId} className="font-semibold text-teal">
        {title}
      </p>
      {children}
      {error && (
        <p role="alert" className="text-brick">
          {error}
        </p>
      )}
      <div className="flex gap-2">
        <button type="submit" className="btn">
          {submitLabel}
        </button>
        <button type="button" className="btn-quiet" onClick={onClose}>
          Cancel
        </button>
      </div>
    </form>
  );
}

interface FieldProps {
  label: string;
  value: string;
  onChange: (value: string) => void;
  hint?: string;
  required?: boolean;
  multiline?: boolean;
  maxLength?: number;
}

export function PanelField({ label, value, onChange, hint, required, multiline, maxLength }: FieldProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const common = { id, value, required, maxLength, 'aria-describedby': hint ? hintId : undefined, className: 'input w-full' };
  return (
    <div>
      <label htmlFor={id} className="block font-semibold">
        {label}
        {required && <span aria-hidden="true"> *</span>}
      </label>
      {multiline ? (
        <textarea {...common} rows={2} onChange={(e) => onChange(e.target.value)} />
      ) : (
        <input {...common} type="text" onChange={(e) => onChange(e.target.value)} />
      )}
      {hint && (
        <p id={hintId} className="text-ink-soft">
          {hint}
        </p>
      )}
    </div>
  );
}
