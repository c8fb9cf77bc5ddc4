// The save indicator's truth: which edit was sent, which the server confirmed. It never claims a save that failed.

export interface SaveState {
  /** Bumped on every change the writer makes. */
  editVersion: number;
  /** The edit version the server last confirmed as stored. */
  savedVersion: number;
  savedAt: string | null;
  /** The edit version being sent now, if any. */
  saving: number | null;
  failure: { message: string; retrying: boolean } | null;
}

export type SaveEvent =
  | { type: 'edited' }
  | { type: 'started'; version: number }
  | { type: 'succeeded'; version: number; at: string }
  | { type: 'failed'; version: number; message: string; retrying: boolean };

export const initialSaveState: SaveState = { editVersion: 0, savedVersion: 0, savedAt: null, saving: null, failure: null };

export function saveReducer(state: SaveState, event: SaveEvent): SaveState {
  switch (event.type) {
    case 'edited':
      return { ...state, editVersion: state.editVersion + 1 };
    case 'started':
      return { ...state, saving: event.version };
    case 'succeeded':
      // An answer for an older version than one already confirmed changes nothing.
      if (event.version < state.savedVersion) return { ...state, saving: null };
      return { ...state, saving: null, savedVersion: event.version, savedAt: event.at, failure: null };
    case 'failed':
      return { ...state, saving: null, failure: { message: event.message, retrying: event.retrying } };
  }
}

export type SaveLabelKind = 'clean' | 'unsaved' | 'saving' | 'saved' | 'failed';

/** What the indicator says. "Saved" only when the server confirmed the newest edit. */
export function saveLabel(state: SaveState, time: (iso: string) => string): { kind: SaveLabelKind; text: string } {
  const upToDate = state.savedVersion === state.editVersion;
  if (state.failure && !upToDate && state.saving === null) {
    const tail = state.failure.retrying ? ' Retrying…' : '';
    return { kind: 'failed', text: `Not saved — ${state.failure.message}${tail}` };
  }
  if (state.saving !== null) return { kind: 'saving', text: 'Saving…' };
  if (!upToDate) return { kind: 'unsaved', text: 'Unsaved changes' };
  if (state.savedAt) return { kind: 'saved', text: `Saved at ${time(state.savedAt)}` };
  return { kind: 'clean', text: 'No changes yet' };
}

/** True while leaving the page would lose something the server does not have. */
export function hasUnsaved(state: SaveState): boolean {
  return state.savedVersion !== state.editVersion;
}

/** Waits before retrying after a failure: 2 s, 4 s, 8 s … up to a minute. */
export function retryDelay(attempt: number): number {
  return Math.min(60_000, 2000 * 2 ** Math.max(0, attempt - 1));
}
