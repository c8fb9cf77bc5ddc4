// The order list's state: loaded from this browser or the account, parts from a fix merged in, every edit kept.
import { useCallback, useEffect, useRef, useState } from 'react';
import { mergeLists, type StoredLine } from '../../../lib/tools/order-list';
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

const plural = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

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
  /** Lines kept in this browser that the account does not hold yet: cleared only once a save has succeeded. */
  const browserCopyPending = useRef(false);
  /** What to say once that save succeeds (the merge message, or nothing in place of the failure). */
  const mergedMessage = useRef<string | null>(null);
  /** Numbers each account save, so an older answer arriving late does not overwrite a newer one's state. */
  const lastSave = useRef(0);

  const sendToAccount = useCallback(async (next: StoredLine[]): Promise<boolean> => {
    const thisSave = ++lastSave.current;
    try {
      await saveAccountLines(next);
    } catch {
      if (thisSave === lastSave.current) setSaveState('failed');
      return false;
    }
    // Every list sent after the merge still holds the browser lines (or the member removed them), so any success will do.
    if (browserCopyPending.current) {
      browserCopyPending.current = false;
      clearBrowserLines();
      setMessage(mergedMessage.current);
    }
    if (thisSave === lastSave.current) setSaveState('saved');
    return true;
  }, []);

  const persist = useCallback(
    (next: StoredLine[]) => {
      if (mode === 'browser') {
        setSaveState(saveBrowserLines(next) ? 'saved' : 'failed');
        return;
      }
      if (timer.current) clearTimeout(timer.current);
      setSaveState('saving');
      timer.current = setTimeout(() => void sendToAccount(next), SAVE_DELAY_MS);
    },
    [mode, sendToAccount],
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
      // First visit signed in: the list kept in this browser joins the saved one, once, and is cleared only once saved.
      const merged = mergeLists(mergeLists(initialLines, incoming), browserCopy);
      setLines(merged);
      browserCopyPending.current = true;
      mergedMessage.current =
        browserCopy.length > 0 ? `Merged ${plural(browserCopy.length, 'line', 'lines')} kept in this browser into your saved list.` : null;
      setSaveState('saving');
      void sendToAccount(merged).then((saved) => {
        // A later save (an edit, "Save again") may have succeeded first and cleared the copy already.
        if (saved || !browserCopyPending.current) return;
        // The parts that just arrived are only in the address, which is cleaned below: keep them with the browser copy.
        const kept = mergeLists(browserCopy, incoming);
        const them = kept.length === 1 ? 'it' : 'them';
        setMessage(
          saveBrowserLines(kept)
            ? `Could not add ${plural(kept.length, 'line', 'lines')} to your saved list; this browser still keeps ${them} and ${them === 'it' ? 'it is' : 'they are'} on this page. Save again, or come back later.`
            : `Could not add ${plural(kept.length, 'line', 'lines')} to your saved list, and this browser would not keep ${them}: ${them === 'it' ? 'it is' : 'they are'} on this page only. Save again, or download the CSV.`,
        );
      });
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
