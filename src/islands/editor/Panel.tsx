// A small panel of fields that opens under the toolbar (insert a link, a reading, a caution, a picture).
// It is not a <form>: it sits inside the fix form, and a form inside a form is invalid HTML whose Enter or button
// would submit the fix form instead. The panel handles its own Enter, button and Escape.
import { useEffect, useId, useRef, type KeyboardEvent, type ReactNode } from 'react';

interface PanelProps {
  title: string;
  submitLabel: string;
  onSubmit: () => void;
  onClose: () => void;
  error?: string | null;
  children: ReactNode;
}

/** Enter in a one-line field or a choice applies the panel, as it would submit a form of its own. */
function appliesOnEnter(target: EventTarget): boolean {
  if (target instanceof HTMLSelectElement) return true;
  return target instanceof HTMLInputElement && !['button', 'submit', 'reset', 'file', 'checkbox'].includes(target.type);
}

export function Panel({ title, submitLabel, onSubmit, onClose, error, children }: PanelProps) {
  const titleId = useId();
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    // The first field takes focus; a panel without fields focuses its button, so Enter still answers it.
    (ref.current?.querySelector<HTMLElement>('input, select, textarea') ?? ref.current?.querySelector<HTMLElement>('button'))?.focus();
  }, []);
  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    if (event.key === 'Escape') {
      event.preventDefault();
      event.stopPropagation();
      onClose();
    } else if (event.key === 'Enter' && !event.nativeEvent.isComposing && appliesOnEnter(event.target)) {
      // Also keeps the browser from submitting the fix form around the panel (implicit submission).
      event.preventDefault();
      event.stopPropagation();
      onSubmit();
    }
  };
  return (
    <div
      ref={ref}
      role="group"
      aria-labelledby={titleId}
      onKeyDown={onKeyDown}
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
        <button type="button" className="btn" onClick={onSubmit}>
          {submitLabel}
        </button>
        <button type="button" className="btn-quiet" onClick={onClose}>
          Cancel
        </button>
      </div>
    </div>
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
