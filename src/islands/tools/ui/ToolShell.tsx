// The frame every tool shares: a GET form to its own page (so it works without JavaScript) beside the result.
import type { SubmitEvent, ReactElement, ReactNode } from 'react';

export interface ToolShellProps {
  path: string;
  onSubmit: (event: SubmitEvent<HTMLFormElement>) => void;
  /** The form's fields. */
  children: ReactNode;
  result: ReactNode;
  submitLabel?: string;
  /** A link that fills the form with the page's worked example. */
  exampleHref?: string;
}

export function ToolShell({ path, onSubmit, children, result, submitLabel = 'Work it out', exampleHref }: ToolShellProps): ReactElement {
  return (
    <div className="tool grid gap-6 print:block lg:grid-cols-[minmax(0,24rem)_minmax(0,1fr)]">
      <form method="get" action={path} onSubmit={onSubmit} className="tool-form panel space-y-4 self-start" noValidate>
        {children}
        <div className="flex flex-wrap items-center gap-3">
          <button className="btn" type="submit">
            {submitLabel}
          </button>
          {exampleHref && (
            <a className="tap text-sm" href={exampleHref}>
              Fill in the worked example
            </a>
          )}
        </div>
      </form>
      <section className="tool-result min-w-0" aria-labelledby="tool-result-heading">
        <h2 id="tool-result-heading" className="mb-2">
          Result
        </h2>
        <div aria-live="polite">{result}</div>
      </section>
    </div>
  );
}

/** A two-column list of figures: what it is, and its value in the monospace. */
export function Figures({ rows }: { rows: ReadonlyArray<{ label: string; value: string; strong?: boolean }> }): ReactElement {
  return (
    <dl className="tool-figures grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
      {rows.map((row) => (
        <div key={row.label} className="contents">
          <dt className="text-ink-soft">{row.label}</dt>
          <dd className={`value ${row.strong ? 'text-lg font-semibold text-teal' : ''}`}>{row.value}</dd>
        </div>
      ))}
    </dl>
  );
}
