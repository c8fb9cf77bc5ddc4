// The order list's actions: spares for every line, CSV download, print, clear.
import { useState, type ReactElement } from 'react';
import type { Spares } from '@/lib/bench/order-list';
import { applySpares, type StoredLine } from '../../../lib/tools/order-list';
import { downloadCsv } from './download';

const sparesChoices: ReadonlyArray<{ value: string; label: string; spares: Spares | undefined }> = [
  { value: 'none', label: 'No spares', spares: undefined },
  { value: 'one', label: '1 of each', spares: { count: 1 } },
  { value: 'two', label: '2 of each', spares: { count: 2 } },
  { value: 'ten', label: '10 %, rounded up', spares: { percent: 10 } },
  { value: 'twenty', label: '20 %, rounded up', spares: { percent: 20 } },
];

export function ListControls({ lines, onChange }: { lines: StoredLine[]; onChange: (next: StoredLine[]) => void }): ReactElement {
  const [sparesChoice, setSparesChoice] = useState('none');
  const chosen = sparesChoices.find((c) => c.value === sparesChoice)?.spares;
  return (
    <div className="no-print flex flex-wrap items-end gap-3">
      <label className="text-sm">
        <span className="block font-semibold">Spares for every line</span>
        <select className="input mt-1" value={sparesChoice} onChange={(e) => setSparesChoice(e.target.value)}>
          {sparesChoices.map((c) => (
            <option key={c.value} value={c.value}>
              {c.label}
            </option>
          ))}
        </select>
      </label>
      <button type="button" className="btn btn-quiet" onClick={() => onChange(applySpares(lines, chosen))}>
        Apply spares
      </button>
      <button type="button" className="btn" onClick={() => downloadCsv(lines)}>
        Download CSV
      </button>
      <button type="button" className="btn btn-quiet" onClick={() => window.print()}>
        Print
      </button>
      <button
        type="button"
        className="btn btn-quiet"
        onClick={() => {
          if (window.confirm('Remove every line from the order list?')) onChange([]);
        }}
      >
        Clear the list
      </button>
    </div>
  );
}
