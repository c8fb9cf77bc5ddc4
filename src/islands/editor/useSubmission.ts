// Submitting: validate with the shared schema, save, submit; show field messages, or both versions on a 409.
import { useState, type FormEvent } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import type { FixDraft, FixDraftInput } from '@/lib/schemas/fix-draft';
import { saveDraftRequest, submitDraftRequest } from './api';
import type { SummaryItem } from './ErrorSummary';
import { flattenErrors, serverFieldItems } from './form-helpers';
import type { EditorRevisionData, LabelledRefData, PhotoRefData } from '../../lib/writing/editor-data';
import type { Autosave } from './useAutosave';

/** The server's field merge after a 409 (src/server/writing/merge.ts): which side changed what, and any clash. */
export interface MergeProposal {
  yours: (keyof FixDraftInput)[];
  theirs: (keyof FixDraftInput)[];
  clashes: (keyof FixDraftInput)[];
  values: FixDraft | null;
}

interface SubmissionOptions {
  form: UseFormReturn<FixDraftInput, unknown, FixDraft>;
  autosave: Autosave;
  doneHref: string;
  setSummary: (summary: { title: string; items: SummaryItem[]; tone?: 'error' | 'info' } | null) => void;
  labels: { machines: LabelledRefData[]; chassis: LabelledRefData[]; photos: PhotoRefData[] };
}

export function useSubmission({ form, autosave, doneHref, setSummary }: SubmissionOptions) {
  const [busy, setBusy] = useState(false);
  const [conflict, setConflict] = useState<EditorRevisionData | null>(null);
  const [merge, setMerge] = useState<MergeProposal | null>(null);

  const send = async () => {
    setBusy(true);
    setSummary(null);
    try {
      const saved = await autosave.flush();
      const draftId = autosave.draftIdNow();
      if (!saved || draftId === null) {
        setSummary({
          title: 'The draft could not be saved, so it was not submitted. Your text is kept in this browser; try again in a moment.',
          items: [],
        });
        return;
      }
      const result = await submitDraftRequest(draftId, form.getValues());
      if (result.ok) {
        autosave.dropJournal();
        window.location.assign(`${doneHref}?submitted=${result.data.revision.number}`);
        return;
      }
      const failure = result.failure;
      const live = failure.extra.live as EditorRevisionData | null | undefined;
      if (failure.status === 409 && live) {
        setConflict(live);
        setMerge((failure.extra.merge as MergeProposal | null | undefined) ?? null);
        return;
      }
      for (const [path, messages] of Object.entries(failure.fields)) form.setError(path as never, { type: 'server', message: messages[0] });
      setSummary({ title: failure.message, items: serverFieldItems(failure.fields) });
    } finally {
      setBusy(false);
    }
  };

  const submit = (event: FormEvent) => {
    void form.handleSubmit(
      () => send(),
      (errors) => {
        setSummary({
          title: 'The revision is not ready to submit yet; see the marked fields. Your draft is saved as it is.',
          items: flattenErrors(errors),
        });
        void autosave.flush();
      },
    )(event);
  };

  /** Moves the draft onto the live revision, keeping every field as the writer has it now. */
  const rebase = async (done = `Your draft now builds on r${conflict?.number}. Check it, then submit again.`) => {
    const draftId = autosave.draftIdNow();
    if (!conflict || draftId === null) return;
    setBusy(true);
    const result = await saveDraftRequest(draftId, form.getValues(), conflict.id);
    setBusy(false);
    if (!result.ok) {
      setSummary({ title: `Could not build on r${conflict.number}: ${result.failure.message}`, items: [] });
      return;
    }
    setSummary({ title: done, items: [], tone: 'info' });
    setConflict(null);
    setMerge(null);
  };

  return { submit, busy, conflict, merge, rebase };
}
