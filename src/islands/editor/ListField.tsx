// A list of short lines (symptoms, error codes): one input per line, Enter adds the next, each line removable.
import { useId, useRef } from 'react';

interface ListFieldProps {
  legend: string;
  /** The word for one line, e.g. "symptom". */
  itemLabel: string;
  hint: string;
  values: string[];
  onChange: (values: string[]) => void;
  maxItems: number;
  maxLength: number;
  error?: string | undefined;
  mono?: boolean;
  id?: string;
}

export function ListField({ legend, itemLabel, hint, values, onChange, maxItems, maxLength, error, mono, id }: ListFieldProps) {
  const baseId = useId();
  const listRef = useRef<HTMLOListElement>(null);
  const focusItem = (index: number) => setTimeout(() => listRef.current?.querySelectorAll<HTMLInputElement>('input')[index]?.focus(), 0);
  const lines = values.length === 0 ? [''] : values;
  const set = (index: number, value: string) => onChange(lines.map((line, i) => (i === index ? value : line)));
  const add = (after: number) => {
    if (lines.length >= maxItems) return;
    onChange([...lines.slice(0, after + 1), '', ...lines.slice(after + 1)]);
    focusItem(after + 1);
  };
  const remove = (index: number) => {
    onChange(lines.filter((_, i) => i !== index));
    focusItem(Math.max(0, index - 1));
  };
  return (
    <fieldset id={id} className="grid gap-2" aria-describedby={`${baseId}-hint ${baseId}-error`} aria-invalid={error ? true : undefined}>
      <legend className="font-sans font-semibold">{legend}</legend>
      <p id={`${baseId}-hint`} className="font-sans text-sm text-ink-soft">
        {hint}
      </p>
      <ol ref={listRef} className="grid gap-2" role="list">
        {lines.map((line, i) => (
          <li key={i} className="flex items-center gap-2">
            <label className="sr-only" htmlFor={`${baseId}-${i}`}>
              {`${itemLabel} ${i + 1}`}
            </label>
            <input
              id={`${baseId}-${i}`}
              className={`input flex-1 ${mono ? 'font-mono' : ''}`}
              value={line}
              maxLength={maxLength}
              onChange={(e) => set(i, e.target.value)}
              onKeyDown={(e) => {
                if (e.key === 'Enter') {
                  e.preventDefault();
                  add(i);
                }
              }}
            />
            <button
              type="button"
              className="btn-quiet"
              aria-label={`Remove ${itemLabel} ${i + 1}`}
              onClick={() => remove(i)}
              disabled={lines.length === 1 && line === ''}
            >
              Remove
            </button>
          </li>
        ))}
      </ol>
      <div>
        <button type="button" className="btn-quiet" onClick={() => add(lines.length - 1)} disabled={lines.length >= maxItems}>
          Add {itemLabel === 'symptom' ? 'a symptom' : `an ${itemLabel}`}
        </button>
      </div>
      <p id={`${baseId}-error`} role={error ? 'alert' : undefined} className="font-sans text-sm text-brick empty:hidden">
        {error}
      </p>
    </fieldset>
  );
}
