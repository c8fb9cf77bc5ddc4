// A list of what stops a submission, each linked to its field; focused when it appears so screen readers hear it.
import { useEffect, useRef } from 'react';

export interface SummaryItem {
  fieldId: string;
  message: string;
}

export function ErrorSummary({ title, items, tone = 'error' }: { title: string; items: SummaryItem[]; tone?: 'error' | 'info' }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    ref.current?.focus();
  }, [title, items.length]);
  return (
    <div
      ref={ref}
      tabIndex={-1}
      role={tone === 'error' ? 'alert' : 'status'}
      className={`rounded border p-3 font-sans text-sm ${tone === 'error' ? 'border-brick bg-brick-wash' : 'border-teal bg-teal-wash'}`}
    >
      <p className={`font-semibold ${tone === 'error' ? 'text-brick' : 'text-teal-dark'}`}>{title}</p>
      {items.length > 0 && (
        <ul className="mt-1 list-disc pl-5">
          {items.map((item, i) => (
            <li key={i}>
              <a
                className="underline"
                href={`#${item.fieldId}`}
                onClick={(e) => {
                  e.preventDefault();
                  const target = document.getElementById(item.fieldId);
                  target?.scrollIntoView({ block: 'center' });
                  (target?.querySelector<HTMLElement>('input, textarea, select, [contenteditable]') ?? target)?.focus();
                }}
              >
                {item.message}
              </a>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

/** Where a server field path points in the form: "parts.2.value" → the parts table, "title" → the title input. */
export function fieldIdOf(path: string): string {
  const head = path.split('.')[0] ?? '';
  if (head === 'chassisIds') return 'field-machineIds';
  return `field-${head}`;
}
