// CSV text of an order list, written with csv-stringify's browser build so islands can use it too.
import { stringify } from 'csv-stringify/browser/esm/sync';
import type { OrderLine } from './order-list';

export const orderListCsvHeader = ['kind', 'part', 'quantity', 'spares', 'to order', 'refs', 'sources', 'notes', 'flag'];

/**
 * A cell that starts with = + - @ or a control character would run as a formula in a spreadsheet:
 * prefix it with an apostrophe (the usual defence against CSV formula injection).
 */
export function safeCell(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

function row(line: OrderLine): string[] {
  return [
    line.kind.replace(/_/g, ' '),
    line.label,
    String(line.quantity),
    String(line.spares),
    String(line.total),
    line.refs.join(' '),
    line.sources.join('; '),
    line.notes.join('; '),
    line.undecodable ? `not decoded: ${line.problem ?? 'unreadable value'}` : '',
  ].map(safeCell);
}

export function orderListCsv(lines: readonly OrderLine[]): string {
  return stringify([orderListCsvHeader, ...lines.map(row)]);
}
