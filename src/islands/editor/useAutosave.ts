// Autosave: a debounced PUT of the draft (POST the first time), the browser journal on every change, honest states.
import { useCallback, useEffect, useReducer, useRef, useState } from 'react';
import type { FixDraftInput } from '@/lib/schemas/fix-draft';
import { createDraftRequest, isTransient, saveDraftRequest, type ApiFailure, type SavedDraft } from './api';
import { clearJournal, journalScope, writeJournal, type JournalEntry } from './journal';
import { initialSaveState, retryDelay, saveReducer, type SaveState } from './save-state';

const DEBOUNCE_MS = 1500;

interface AutosaveOptions {
  initialDraftId: number | null;
  fixSlug: string | null;
  getValues: () => FixDraftInput;
  getRefs: () => NonNullable<JournalEntry['refs']>;
  onSaved: (saved: SavedDraft) => void;
  onRefused: (failure: ApiFailure) => void;
}

export interface Autosave {
  state: SaveState;
  draftId: number | null;
  /** The draft's id right now (state may lag a render behind). */
  draftIdNow: () => number | null;
  journalFailed: boolean;
  markEdited: () => void;
  /** Saves now; true when the server holds the newest edit afterwards. */
  flush: () => Promise<boolean>;
  /** Forget the journal (after a submission, or when the writer discards restored changes). */
  dropJournal: () => void;
}

function storage(): Storage | null {
  try {
    return window.localStorage;
  } catch {
    return null;
  }
}

export function useAutosave(options: AutosaveOptions): Autosave {
  const [state, dispatch] = useReducer(saveReducer, initialSaveState);
  const [draftId, setDraftId] = useState(options.initialDraftId);
  const [journalFailed, setJournalFailed] = useState(false);
  const draftRef = useRef(options.initialDraftId);
  const versions = useRef({ edit: 0, saved: 0 });
  const inFlight = useRef<Promise<void> | null>(null);
  const again = useRef(false);
  const timers = useRef<{
    debounce?: ReturnType<typeof setTimeout>;
    retry?: ReturnType<typeof setTimeout>;
    journal?: ReturnType<typeof setTimeout>;
  }>({});
  const attempts = useRef(0);
  const opts = useRef(options);
  opts.current = options;
  const scope = () => journalScope({ draftId: draftRef.current, fixSlug: opts.current.fixSlug });

  const writeLocal = useCallback(() => {
    const store = storage();
    const ok =
      store !== null &&
      writeJournal(store, scope(), {
        version: 1,
        editedAt: new Date().toISOString(),
        draftId: draftRef.current,
        values: opts.current.getValues(),
        refs: opts.current.getRefs(),
      });
    setJournalFailed(!ok);
  }, []);

  const save = useCallback(async (): Promise<void> => {
    if (inFlight.current) {
      again.current = true;
      return inFlight.current;
    }
    const version = versions.current.edit;
    if (version === versions.current.saved && draftRef.current !== null) return;
    const run = (async () => {
      dispatch({ type: 'started', version });
      const values = opts.current.getValues();
      const wasNew = draftRef.current === null;
      const result = wasNew ? await createDraftRequest(opts.current.fixSlug, values) : await saveDraftRequest(draftRef.current!, values);
      if (result.ok) {
        const oldScope = scope();
        draftRef.current = result.data.revision.id;
        setDraftId(draftRef.current);
        versions.current.saved = Math.max(versions.current.saved, version);
        attempts.current = 0;
        dispatch({ type: 'succeeded', version, at: result.data.revision.updatedAt });
        const store = storage();
        if (store && wasNew) clearJournal(store, oldScope);
        if (store && version === versions.current.edit) clearJournal(store, scope());
        else writeLocal();
        opts.current.onSaved(result.data);
        return;
      }
      const retrying = isTransient(result.failure);
      dispatch({ type: 'failed', version, message: result.failure.message, retrying });
      if (retrying) {
        attempts.current++;
        clearTimeout(timers.current.retry);
        timers.current.retry = setTimeout(() => void save(), retryDelay(attempts.current));
      } else {
        opts.current.onRefused(result.failure);
      }
    })();
    inFlight.current = run;
    try {
      await run;
    } finally {
      inFlight.current = null;
      if (again.current) {
        again.current = false;
        void save();
      }
    }
  }, [writeLocal]);

  const markEdited = useCallback(() => {
    versions.current.edit++;
    dispatch({ type: 'edited' });
    clearTimeout(timers.current.journal);
    timers.current.journal = setTimeout(writeLocal, 300);
    clearTimeout(timers.current.debounce);
    timers.current.debounce = setTimeout(() => void save(), DEBOUNCE_MS);
  }, [save, writeLocal]);

  const flush = useCallback(async () => {
    clearTimeout(timers.current.debounce);
    await save();
    if (inFlight.current) await inFlight.current;
    return versions.current.edit === versions.current.saved;
  }, [save]);

  const dropJournal = useCallback(() => {
    const store = storage();
    if (store) clearJournal(store, scope());
  }, []);

  useEffect(() => {
    const beforeUnload = (event: BeforeUnloadEvent) => {
      if (versions.current.edit === versions.current.saved) return;
      writeLocal();
      event.preventDefault();
      event.returnValue = '';
    };
    const online = () => {
      if (versions.current.edit !== versions.current.saved) void save();
    };
    window.addEventListener('beforeunload', beforeUnload);
    window.addEventListener('online', online);
    const pending = timers.current;
    return () => {
      window.removeEventListener('beforeunload', beforeUnload);
      window.removeEventListener('online', online);
      clearTimeout(pending.debounce);
      clearTimeout(pending.retry);
      clearTimeout(pending.journal);
    };
  }, [save, writeLocal]);

  const draftIdNow = useCallback(() => draftRef.current, []);
  return { state, draftId, draftIdNow, journalFailed, markEdited, flush, dropJournal };
}
