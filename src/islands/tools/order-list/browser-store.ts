// The order list kept in this browser (localStorage): read defensively, written whole after each change.
import { readStoredLines, type StoredLine } from '../../../lib/tools/order-list';

export const STORAGE_KEY = 'benchlore.order-list.v1';

export function loadBrowserLines(): StoredLine[] {
  try {
    const raw = window.localStorage.getItem(STORAGE_KEY);
    if (raw === null) return [];
    const parsed: unknown = JSON.parse(raw);
    return readStoredLines((parsed as { lines?: unknown } | null)?.lines);
  } catch {
    // Storage blocked, full or edited by hand: start from an empty list rather than fail.
    return [];
  }
}

/** False when the browser refuses (private mode, storage full): the page then says so. */
export function saveBrowserLines(lines: readonly StoredLine[]): boolean {
  try {
    window.localStorage.setItem(STORAGE_KEY, JSON.stringify({ lines }));
    return true;
  } catch {
    return false;
  }
}

export function clearBrowserLines(): void {
  try {
    window.localStorage.removeItem(STORAGE_KEY);
  } catch {
    // Nothing to clear when storage is blocked.
  }
}

/** The address without the parts that arrived in it, so a reload does not add them twice. */
export function cleanAddress(): void {
  const url = new URL(window.location.href);
  if (!url.searchParams.has('add') && !url.searchParams.has('added') && !url.searchParams.has('from')) return;
  url.searchParams.delete('add');
  url.searchParams.delete('added');
  url.searchParams.delete('from');
  const query = url.searchParams.toString();
  window.history.replaceState(window.history.state, '', `${url.pathname}${query === '' ? '' : `?${query}`}`);
}
