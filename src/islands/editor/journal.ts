// The browser's own copy of unsaved edits (localStorage, one entry per fix), so a lost connection or tab loses nothing.
import type { FixDraftInput } from '@/lib/schemas/fix-draft';
import type { LabelledRefData, PhotoRefData } from '../../lib/writing/editor-data';

export interface JournalEntry {
  version: 1;
  /** When the writer last changed something, by this browser's clock (ISO). */
  editedAt: string;
  draftId: number | null;
  values: FixDraftInput;
  /** Labels of the machines, chassis families and photos the values name by id. */
  refs?: { machines: LabelledRefData[]; chassis: LabelledRefData[]; photos: PhotoRefData[] };
}

export type JournalStore = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

const prefix = 'benchlore:journal:';

/** The journal's scope: `new` for a fix not yet saved, `draft:12` once it has a draft, `fix:slug` for an edit. */
export function journalScope(input: { draftId: number | null; fixSlug: string | null }): string {
  if (input.draftId !== null) return `draft:${input.draftId}`;
  return input.fixSlug ? `fix:${input.fixSlug}` : 'new';
}

function isEntry(value: unknown): value is JournalEntry {
  const v = value as JournalEntry;
  return (
    typeof v === 'object' &&
    v !== null &&
    v.version === 1 &&
    typeof v.editedAt === 'string' &&
    !Number.isNaN(Date.parse(v.editedAt)) &&
    typeof v.values === 'object' &&
    v.values !== null
  );
}

export function readJournal(store: JournalStore, scope: string): JournalEntry | null {
  try {
    const raw = store.getItem(prefix + scope);
    if (raw === null) return null;
    const parsed: unknown = JSON.parse(raw);
    if (isEntry(parsed)) return parsed;
  } catch {
    // Unreadable (private mode, corrupt entry): fall through and drop it.
  }
  try {
    store.removeItem(prefix + scope);
  } catch {
    // Storage may be unavailable altogether.
  }
  return null;
}

/** False when the browser refused (quota, private mode): the indicator then says so rather than pretend. */
export function writeJournal(store: JournalStore, scope: string, entry: JournalEntry): boolean {
  try {
    store.setItem(prefix + scope, JSON.stringify(entry));
    return true;
  } catch {
    return false;
  }
}

export function clearJournal(store: JournalStore, scope: string): void {
  try {
    store.removeItem(prefix + scope);
  } catch {
    // Nothing to clear if storage is unavailable.
  }
}

/**
 * Restore the journal when it was edited after the server's copy was saved and says something different. A clock
 * skew between browser and server can only make us offer a restore the writer may decline, never lose text.
 */
export function shouldRestore(
  entry: JournalEntry | null,
  server: { updatedAt: string | null; values: FixDraftInput },
): entry is JournalEntry {
  if (!entry) return false;
  if (JSON.stringify(entry.values) === JSON.stringify(server.values)) return false;
  if (server.updatedAt === null) return true;
  return Date.parse(entry.editedAt) > Date.parse(server.updatedAt);
}
