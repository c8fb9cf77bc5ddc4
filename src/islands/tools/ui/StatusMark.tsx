// A check's status in words and a symbol, so pass, warn and fail never rest on colour alone.
import type { ReactElement } from 'react';

export type Status = 'pass' | 'warn' | 'fail' | 'good' | 'marginal' | 'replace';

const looks: Record<Status, { text: string; symbol: string; className: string }> = {
  pass: { text: 'Pass', symbol: '✓', className: 'border-teal text-teal' },
  good: { text: 'Good', symbol: '✓', className: 'border-teal text-teal' },
  warn: { text: 'Check', symbol: '!', className: 'border-amber text-amber-ink' },
  marginal: { text: 'Worn', symbol: '!', className: 'border-amber text-amber-ink' },
  fail: { text: 'Fail', symbol: '✗', className: 'border-brick text-brick' },
  replace: { text: 'Replace', symbol: '✗', className: 'border-brick text-brick' },
};

export function StatusMark({ status }: { status: Status }): ReactElement {
  const look = looks[status];
  return (
    <span className={`inline-flex min-w-[5.5rem] items-center gap-1 rounded border px-2 py-0.5 text-sm font-semibold ${look.className}`}>
      <span aria-hidden="true">{look.symbol}</span>
      {look.text}
    </span>
  );
}
