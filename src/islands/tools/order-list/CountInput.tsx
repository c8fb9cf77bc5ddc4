// A whole-number input for quantities and spares: keeps what is typed, applies it only when it is valid.
import { useEffect, useId, useState, type ReactElement } from 'react';
import { MAX_LINE_QUANTITY } from '../../../lib/tools/order-list';

export interface CountInputProps {
  label: string;
  value: number;
  min: number;
  onCommit: (value: number) => void;
}

export function CountInput({ label, value, min, onCommit }: CountInputProps): ReactElement {
  const id = useId();
  const [draft, setDraft] = useState(String(value));
  useEffect(() => setDraft(String(value)), [value]);
  const parsed = Number(draft);
  const valid = /^\d+$/.test(draft.trim()) && parsed >= min && parsed <= MAX_LINE_QUANTITY;
  return (
    <span className="inline-block">
      <label htmlFor={id} className="sr-only">
        {label}
      </label>
      <input
        id={id}
        type="number"
        inputMode="numeric"
        min={min}
        max={MAX_LINE_QUANTITY}
        step={1}
        className={`input value no-print w-20 text-right ${valid ? '' : 'border-brick'}`}
        value={draft}
        aria-invalid={valid ? undefined : true}
        aria-describedby={valid ? undefined : `${id}-error`}
        onChange={(event) => {
          setDraft(event.target.value);
          const next = Number(event.target.value);
          if (/^\d+$/.test(event.target.value.trim()) && next >= min && next <= MAX_LINE_QUANTITY) onCommit(next);
        }}
      />
      <span className="print-only value">{value}</span>
      {!valid && (
        <span id={`${id}-error`} className="block text-xs text-brick">
          A whole number from {min}, e.g. {Math.max(min, 1)}.
        </span>
      )}
    </span>
  );
}
