// The order list's state: loaded from this browser or the account, parts from a fix merged in, every edit kept.
import { useCallback, useEffect, useRef, useState } from 'react';
import { mergeLists, type StoredLine } from '../model/order-list';
import { saveAccountLines, type SaveState } from './account-store';
import { cleanAddress, clearBrowserLines, loadBrowserLines, saveBrowserLines } from './browser-store';

export type ListMode = 'browser' | 'account';

export interface OrderListState {
  lines: StoredLine[];
  /** False until the browser copy has been read; nothing is written before that. */
  loaded: boolean;
  saveState: SaveState;
  message: string | null;
  update: (next: StoredLine[]) => void;
}

const SAVE_DELAY_MS = 400;

function countParts(lines: readonly StoredLine[]): number {
  return lines.reduce((sum, l) => sum + l.quantity, 0);
}

export function useOrderList(mode: ListMode, initialLines: StoredLine[], incoming: StoredLine[]): OrderListState {
  // The first render matches the server's: the member's list, or the parts that just arrived.
  const [lines, setLines] = useState<StoredLine[]>(mode === 'account' ? mergeLists(initialLines, incoming) : incoming);
  const [loaded, setLoaded] = useState(false);
  const [saveState, setSaveState] = useState<SaveState>('idle');
  const [message, setMessage] = useState<string | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  const persist = useCallback(
    (next: StoredLine[], immediately = false) => {
      if (mode === 'browser') {
        setSaveState(saveBrowserLines(next) ? 'saved' : 'failed');
        return;
      }
      if (timer.current) clearTimeout(timer.current);
      setSaveState('saving');
      const send = () =>
        saveAccountLines(next)
          .then(() => setSaveState('saved'))
          .catch(() => setSaveState('failed'));
      if (immediately) void send();
      else timer.current = setTimeout(() => void send(), SAVE_DELAY_MS);
    },
    [mode],
  );

  useEffect(() => {
    const browserCopy = loadBrowserLines();
    if (mode === 'browser') {
      const merged = mergeLists(browserCopy, incoming);
      setLines(merged);
      if (incoming.length > 0) {
        persist(merged);
        setMessage(`Added ${countParts(incoming)} ${countParts(incoming) === 1 ? 'part' : 'parts'} to the list kept in this browser.`);
      }
    } else if (browserCopy.length > 0 || incoming.length > 0) {
      // First visit signed in: the list kept in this browser joins the saved one, once.
      const merged = mergeLists(mergeLists(initialLines, incoming), browserCopy);
      setLines(merged);
      persist(merged, true);
      clearBrowserLines();
      if (browserCopy.length > 0)
        setMessage(
          `Merged ${browserCopy.length} ${browserCopy.length === 1 ? 'line' : 'lines'} kept in this browser into your saved list.`,
        );
    }
    cleanAddress();
    setLoaded(true);
    // Runs once on load: the props are the server's snapshot and never change.
  }, []);

  const update = useCallback(
    (next: StoredLine[]) => {
      setLines(next);
      persist(next);
    },
    [persist],
  );

  return { lines, loaded, saveState, message, update };
}
