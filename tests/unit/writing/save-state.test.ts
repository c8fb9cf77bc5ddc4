// The save indicator: "saved" only for the newest edit the server confirmed; failures say so and keep saying so.
import { describe, expect, it } from 'vitest';
import {
  hasUnsaved,
  initialSaveState,
  retryDelay,
  saveLabel,
  saveReducer,
  type SaveEvent,
  type SaveState,
} from '@/islands/editor/save-state';

const run = (...events: SaveEvent[]): SaveState => events.reduce(saveReducer, initialSaveState);
const label = (state: SaveState) => saveLabel(state, (iso) => iso.slice(11, 16));

describe('saveReducer and saveLabel', () => {
  it('goes unsaved → saving → saved at hh:mm', () => {
    expect(label(run({ type: 'edited' })).text).toBe('Unsaved changes');
    expect(label(run({ type: 'edited' }, { type: 'started', version: 1 })).text).toBe('Saving…');
    const saved = run({ type: 'edited' }, { type: 'started', version: 1 }, { type: 'succeeded', version: 1, at: '2026-01-05T10:42:00Z' });
    expect(label(saved)).toEqual({ kind: 'saved', text: 'Saved at 10:42' });
    expect(hasUnsaved(saved)).toBe(false);
  });

  it('does not claim saved when the writer typed during the save', () => {
    const state = run(
      { type: 'edited' },
      { type: 'started', version: 1 },
      { type: 'edited' },
      { type: 'succeeded', version: 1, at: '2026-01-05T10:42:00Z' },
    );
    expect(label(state).kind).toBe('unsaved');
    expect(hasUnsaved(state)).toBe(true);
  });

  it('shows the server’s message when a save fails, and that it retries', () => {
    const state = run(
      { type: 'edited' },
      { type: 'started', version: 1 },
      { type: 'failed', version: 1, message: 'the server could not be reached (offline?)', retrying: true },
    );
    expect(label(state)).toEqual({ kind: 'failed', text: 'Not saved — the server could not be reached (offline?) Retrying…' });
    expect(hasUnsaved(state)).toBe(true);
  });

  it('ignores a late answer for an older version', () => {
    const state = run(
      { type: 'edited' },
      { type: 'edited' },
      { type: 'succeeded', version: 2, at: '2026-01-05T10:43:00Z' },
      { type: 'succeeded', version: 1, at: '2026-01-05T10:44:00Z' },
    );
    expect(state.savedVersion).toBe(2);
    expect(label(state).text).toBe('Saved at 10:43');
  });

  it('backs off 2 s, 4 s, 8 s up to a minute', () => {
    expect([1, 2, 3, 10].map(retryDelay)).toEqual([2000, 4000, 8000, 60000]);
  });
});
