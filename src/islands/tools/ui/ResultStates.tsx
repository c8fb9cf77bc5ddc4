// What a tool shows before its result: a prompt, the fields still needed, or a summary of what is wrong.
import type { ReactElement } from 'react';
import type { Outcome } from '../../../lib/tools/form-reader';
import { FieldError } from './Field';

export function NotYet<F extends string, R>({
  outcome,
  labels,
}: {
  outcome: Outcome<F, R>;
  labels: Record<F, string>;
}): ReactElement | null {
  switch (outcome.state) {
    case 'empty':
      return <p className="text-ink-soft">Fill in the fields; the result appears here as you type.</p>;
    case 'incomplete':
      return <p className="text-ink-soft">Still needed: {outcome.missing.map((name) => labels[name]).join(', ')}.</p>;
    case 'invalid':
      return (
        <div className="tool-invalid rounded border border-brick bg-brick-wash p-3" role="alert">
          {outcome.general ? (
            <FieldError error={outcome.general} />
          ) : (
            <p className="text-brick">
              Check {Object.keys(outcome.errors).length === 1 ? 'the field' : 'the fields'} marked above:{' '}
              {(Object.keys(outcome.errors) as F[]).map((name) => labels[name]).join(', ')}.
            </p>
          )}
        </div>
      );
    default:
      return null;
  }
}

/** The inputs as read, printed above the result because the form itself does not print. */
export function PrintedInputs<F extends string>({
  fields,
  labels,
}: {
  fields: Record<F, string>;
  labels: Record<F, string>;
}): ReactElement {
  const given = (Object.keys(labels) as F[]).filter((name) => (fields[name] ?? '').trim() !== '');
  return (
    <dl className="print-only mb-2 text-sm">
      {given.map((name) => (
        <div key={name}>
          <dt className="inline font-semibold">{labels[name]}: </dt>
          <dd className="value inline">{fields[name]}</dd>
        </div>
      ))}
    </dl>
  );
}
