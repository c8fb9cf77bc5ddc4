// Order list island: the parts to buy, merged by canonical spec, kept in this browser or with the member's account.
import '@/lib/schemas/zod-in-browser';
import type { ReactElement } from 'react';
import type { StoredLine } from '../lib/tools/order-list';
import type { SaveState } from './tools/order-list/account-store';
import { ListControls } from './tools/order-list/ListControls';
import { OrderTable } from './tools/order-list/OrderTable';
import { useOrderList, type ListMode } from './tools/order-list/use-order-list';

export interface OrderListProps {
  mode: ListMode;
  initialLines: StoredLine[];
  incoming: StoredLine[];
}

const saveText: Record<ListMode, Record<SaveState, string>> = {
  account: {
    idle: '',
    saving: 'Saving…',
    saved: 'Saved with your account.',
    failed: 'Could not save the last change; it is still on this page.',
  },
  browser: {
    idle: '',
    saving: '',
    saved: 'Kept in this browser.',
    failed: 'This browser would not keep the list (private mode or storage full); download the CSV to keep it.',
  },
};

const plural = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

export default function OrderList({ mode, initialLines, incoming }: OrderListProps): ReactElement {
  const list = useOrderList(mode, initialLines, incoming);
  const total = list.lines.reduce((sum, l) => sum + l.quantity + l.spares, 0);
  return (
    <div className="order-list space-y-4">
      {list.message && (
        <p className="panel no-print" role="status">
          {list.message}
        </p>
      )}
      {!list.loaded && mode === 'browser' && list.lines.length === 0 && (
        <p className="text-ink-soft">Reading the list kept in this browser…</p>
      )}
      {list.loaded && list.lines.length === 0 && (
        <p className="panel">
          The order list is empty. Every parts table on a fix page has <strong>Add to order list</strong> beside each part and below the
          table.
        </p>
      )}
      {list.lines.length > 0 && (
        <>
          <OrderTable lines={list.lines} onChange={list.update} />
          <p className="text-sm">
            {plural(list.lines.length, 'line', 'lines')}, {plural(total, 'part', 'parts')} to order.
          </p>
          <ListControls lines={list.lines} onChange={list.update} />
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
