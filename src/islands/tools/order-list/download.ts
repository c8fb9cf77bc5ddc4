// Saves the order list as a CSV file from the browser, with the same writer the API uses.
import { storedListCsv, type StoredLine } from '../../../lib/tools/order-list';

export function downloadCsv(lines: readonly StoredLine[], filename = 'order-list.csv'): void {
  // The byte-order mark makes spreadsheets read µ, ° and Ø as UTF-8.
  const blob = new Blob([`\uFEFF${storedListCsv(lines)}`], { type: 'text/csv;charset=utf-8' });
  const href = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = href;
  link.download = filename;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(href), 10_000);
}
