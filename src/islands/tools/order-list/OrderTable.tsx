// The order list as a table: one line per canonical spec, with quantity, spares, total and a remove button.
import type { ReactElement } from 'react';
import { removeLine, setQuantity, setSpares, type StoredLine } from '../../../lib/tools/order-list';
import { CountInput } from './CountInput';

export interface OrderTableProps {
  lines: StoredLine[];
  onChange: (next: StoredLine[]) => void;
}

function PartCell({ line }: { line: StoredLine }): ReactElement {
  return (
    <>
      <span className="value">{line.label}</span>
      <span className="block text-xs text-ink-soft">{line.kind.replace(/_/g, ' ')}</span>
      {line.undecodable && (
        <span className="block text-xs text-amber-ink">Not decoded, kept as written: {line.problem ?? 'unreadable value'}</span>
      )}
      {line.notes.length > 0 && <span className="block text-xs text-ink-soft">{line.notes.join('; ')}</span>}
    </>
  );
}

export function OrderTable({ lines, onChange }: OrderTableProps): ReactElement {
  return (
    <div className="overflow-x-auto">
      <table className="order-table w-full border-collapse text-sm">
        <caption className="sr-only">Parts to order</caption>
        <thead>
          <tr className="bg-paper-deep text-left">
            <th scope="col" className="px-3 py-2">
              Part
            </th>
            <th scope="col" className="px-3 py-2">
              Refs
            </th>
            <th scope="col" className="px-3 py-2">
              From
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Qty
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Spares
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              To order
            </th>
            <th scope="col" className="no-print px-3 py-2">
              <span className="sr-only">Remove</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {lines.map((line) => (
            <tr key={line.key} className="border-b border-rule align-top" data-key={line.key}>
              <td className="px-3 py-2">
                <PartCell line={line} />
              </td>
              <td className="value px-3 py-2">{line.refs.join(' ') || '—'}</td>
              <td className="px-3 py-2">{line.sources.join('; ')}</td>
              <td className="px-3 py-2 text-right">
                <CountInput
                  label={`Quantity of ${line.label}`}
                  value={line.quantity}
                  min={1}
                  onCommit={(n) => onChange(setQuantity(lines, line.key, n))}
                />
              </td>
              <td className="px-3 py-2 text-right">
                <CountInput
                  label={`Spares of ${line.label}`}
                  value={line.spares}
                  min={0}
                  onCommit={(n) => onChange(setSpares(lines, line.key, n))}
                />
              </td>
              <td className="value px-3 py-2 text-right font-semibold">{line.quantity + line.spares}</td>
              <td className="no-print px-3 py-2">
                <button type="button" className="btn btn-quiet" onClick={() => onChange(removeLine(lines, line.key))}>
                  Remove<span className="sr-only"> {line.label}</span>
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
