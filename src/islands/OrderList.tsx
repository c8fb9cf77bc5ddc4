// Order list island: the parts to buy, merged by canonical spec, kept in this browser or with the member's account.
import { useState, type ReactElement } from 'react';
import type { Spares } from '@/lib/bench/order-list';
import { applySpares, type StoredLine } from './tools/model/order-list';
import { downloadCsv } from './tools/order-list/download';
import { OrderTable } from './tools/order-list/OrderTable';
import { useOrderList, type ListMode } from './tools/order-list/use-order-list';
import type { SaveState } from './tools/order-list/account-store';

export interface OrderListProps {
  mode: ListMode;
  initialLines: StoredLine[];
  incoming: StoredLine[];
}

const sparesChoices: ReadonlyArray<{ value: string; label: string; spares: Spares | undefined }> = [
  { value: 'none', label: 'No spares', spares: undefined },
  { value: 'one', label: '1 of each', spares: { count: 1 } },
  { value: 'two', label: '2 of each', spares: { count: 2 } },
  { value: 'ten', label: '10 %, rounded up', spares: { percent: 10 } },
  { value: 'twenty', label: '20 %, rounded up', spares: { percent: 20 } },
];

const saveText: Record<ListMode, Record<SaveState, string>> = {
  account: { idle: '', saving: 'Saving…', saved: 'Saved with your account.', failed: 'Could not save the last change; it is still on this page.' },
  browser: { idle: '', saving: '', saved: 'Kept in this browser.', failed: 'This browser would not keep the list (private mode or storage full); download the CSV to keep it.' },
};

export default function OrderList({ mode, initialLines, incoming }: OrderListProps): ReactElement {
  const list = useOrderList(mode, initialLines, incoming);
  const [sparesChoice, setSparesChoice] = useState('none');
  const total = list.lines.reduce((sum, l) => sum + l.quantity + l.spares, 0);
  return (
    <div className="order-list space-y-4">
      {list.message && (
        <p className="panel no-print" role="status">
          {list.message}
        </p>
      )}
      {!list.loaded && mode === 'browser' && list.lines.length === 0 && <p className="text-ink-soft">Reading the list kept in this browser…</p>}
      {list.loaded && list.lines.length === 0 && (
        <p className="panel">
          The order list is empty. Every parts table on a fix page has <strong>Add to order list</strong> beside each part and below the table.
        </p>
      )}
      {list.lines.length > 0 && (
        <>
          <OrderTable lines={list.lines} onChange={list.update} />
          <p className="text-sm">
            {list.lines.length} {list.lines.length === 1 ? 'line' : 'lines'}, {total} {total === 1 ? 'part' : 'parts'} to order.
          </p>
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
            <button type="button" className="btn btn-quiet" onClick={() => list.update(applySpares(list.lines, sparesChoices.find((c) => c.value === sparesChoice)?.spares))}>
              Apply spares
            </button>
            <button type="button" className="btn" onClick={() => downloadCsv(list.lines)}>
              Download CSV
            </button>
            <button type="button" className="btn btn-quiet" onClick={() => window.print()}>
              Print
            </button>
            <button
              type="button"
              className="btn btn-quiet"
              onClick={() => {
                if (window.confirm('Remove every line from the order list?')) list.update([]);
              }}
            >
              Clear the list
            </button>
          </div>
        </>
      )}
      <p className="no-print text-sm text-ink-soft" role="status">
        {saveText[mode][list.saveState]}
        {mode === 'account' && list.saveState === 'failed' && (
          <>
            {' '}
            <button type="button" className="btn btn-quiet min-h-0 px-2 py-1 text-sm" onClick={() => list.update(list.lines)}>
              Save again
            </button>
          </>
        )}
      </p>
    </div>
  );
}
