// The browser journal: restored only when newer than the server's copy and different from it; never throws.
import { describe, expect, it } from 'vitest';
import { emptyDraft } from '@/lib/schemas/fix-draft';
import { clearJournal, journalScope, readJournal, shouldRestore, writeJournal, type JournalStore } from '@/islands/editor/journal';

function memoryStore(): JournalStore & { map: Map<string, string> } {
  const map = new Map<string, string>();
  return { map, getItem: (k) => map.get(k) ?? null, setItem: (k, v) => void map.set(k, v), removeItem: (k) => void map.delete(k) };
}

const entry = (editedAt: string, title: string) => ({ version: 1 as const, editedAt, draftId: 4, values: { ...emptyDraft(), title } });

describe('journal', () => {
  it('round-trips an entry per scope', () => {
    const store = memoryStore();
    expect(writeJournal(store, 'draft:4', entry('2026-01-05T10:00:00Z', 'Belt slips'))).toBe(true);
    expect(readJournal(store, 'draft:4')?.values.title).toBe('Belt slips');
    expect(readJournal(store, 'draft:5')).toBeNull();
    clearJournal(store, 'draft:4');
    expect(readJournal(store, 'draft:4')).toBeNull();
  });

  it('drops a corrupt entry instead of failing', () => {
    const store = memoryStore();
    store.setItem('benchlore:journal:new', '{not json');
    expect(readJournal(store, 'new')).toBeNull();
    expect(store.map.size).toBe(0);
  });

  it('reports a refused write (quota) rather than pretending', () => {
    const full: JournalStore = {
      getItem: () => null,
      setItem: () => {
        throw new Error('QuotaExceededError');
      },
      removeItem: () => undefined,
    };
    expect(writeJournal(full, 'new', entry('2026-01-05T10:00:00Z', 'x'))).toBe(false);
  });

  it('restores only an entry edited after the server saved and differing from it', () => {
    const server = { updatedAt: '2026-01-05T10:00:00Z', values: { ...emptyDraft(), title: 'On the server' } };
    expect(shouldRestore(entry('2026-01-05T10:05:00Z', 'Typed later'), server)).toBe(true);
    expect(shouldRestore(entry('2026-01-05T09:55:00Z', 'Typed before'), server)).toBe(false);
    expect(shouldRestore(entry('2026-01-05T10:05:00Z', 'On the server'), server)).toBe(false);
    expect(shouldRestore(entry('2026-01-05T10:05:00Z', 'Never saved'), { updatedAt: null, values: emptyDraft() })).toBe(true);
    expect(shouldRestore(null, server)).toBe(false);
  });

  it('names scopes by draft, then live fix, then new', () => {
    expect(journalScope({ draftId: 9, fixSlug: 'x' })).toBe('draft:9');
    expect(journalScope({ draftId: null, fixSlug: 'belt-slips' })).toBe('fix:belt-slips');
    expect(journalScope({ draftId: null, fixSlug: null })).toBe('new');
  });
});
