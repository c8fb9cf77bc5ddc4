// The fix form: every field of a revision, autosaved; submission with field messages and the stale-base comparison.
import { Suspense, useCallback, useEffect, useRef, useState, type KeyboardEvent } from 'react';
import { Controller, useForm } from 'react-hook-form';
import type { Editor } from '@tiptap/react';
import type { FixDraft, FixDraftInput, HeldFields } from '@/lib/schemas/fix-draft';
import { fixDraftLimits } from '@/lib/schemas/fix-draft-values';
import { difficulties, difficultyLabels } from '@/lib/schemas/revision-values';
import type { BodyDoc } from '@/lib/tiptap/allowlist';
import PhotoUploader, { type IncomingFiles } from '../PhotoUploader';
import { AppliesTo } from './AppliesTo';
import { CautionsEditor } from './CautionsEditor';
import { ErrorSummary, type SummaryItem } from './ErrorSummary';
import { sectionFields, serverFieldItems } from './form-helpers';
import { Field } from './Field';
import { ListField } from './ListField';
import { PartsEditor } from './PartsEditor';
import { PhotoList } from './PhotoList';
import { ReadingsEditor } from './ReadingsEditor';
import { SaveIndicator } from './SaveIndicator';
import { SimilarFixes } from './SimilarFixes';
import { insertFigureLater as insertFigure, LazyBodyEditor, LazyStaleBasePanel, preloadLaterParts, submissionResolver } from './later';
import { useAutosave } from './useAutosave';
import { useRestoredStart } from './useRestoredStart';
import { useSubmission } from './useSubmission';
import type { EditorRevisionData, FixEditorProps, LabelledRefData, PhotoRefData } from '../../lib/writing/editor-data';

/** Enter in a one-line field never sends the revision to the desk: only the submit button does. */
function keepEnterFromSubmitting(event: KeyboardEvent<HTMLFormElement>): void {
  const target = event.target;
  if (event.key !== 'Enter' || event.defaultPrevented || !(target instanceof HTMLInputElement)) return;
  if (!['submit', 'button', 'file'].includes(target.type)) event.preventDefault();
}

/** Where the remedy editor will be, the same height, while its code loads. */
function RemedyLoading() {
  return (
    <div className="min-h-[17rem] rounded border border-rule-strong bg-paper p-3 font-sans text-sm text-ink-soft" role="status">
      Loading the remedy editor…
    </div>
  );
}

export function FixForm(props: FixEditorProps) {
  const start = useRestoredStart(props);
  const form = useForm<FixDraftInput, unknown, FixDraft>({
    defaultValues: start.values,
    resolver: submissionResolver,
    mode: 'onSubmit',
  });
  const { register, control, setValue, getValues, formState } = form;
  // The editor and the submission check load while the writer reads the form.
  useEffect(preloadLaterParts, []);
  const [machines, setMachines] = useState<LabelledRefData[]>(start.machines);
  const [chassis, setChassis] = useState<LabelledRefData[]>(start.chassis);
  const [photos, setPhotos] = useState<PhotoRefData[]>(start.photos);
  const [incoming, setIncoming] = useState<IncomingFiles | null>(null);
  const [summary, setSummary] = useState<{ title: string; items: SummaryItem[]; tone?: 'error' | 'info' } | null>(null);
  const [baseNote, setBaseNote] = useState<string | null>(
    props.draft && props.draft.baseRevisionId !== props.draft.liveRevisionId
      ? 'The live fix changed since this draft was started; submitting will show both versions.'
      : null,
  );
  const editorRef = useRef<Editor | null>(null);
  const pendingInserts = useRef<PhotoRefData[]>([]);
  const refsRef = useRef({ machines, chassis, photos });
  refsRef.current = { machines, chassis, photos };

  // Fields the server holds as typed are marked where they stand until a save answers without them.
  const [heldCount, setHeldCount] = useState(Object.keys(start.held).length);
  const heldPaths = useRef<string[]>([]);
  const markHeld = useCallback(
    (held: HeldFields) => {
      for (const path of heldPaths.current) if (!(path in held)) form.clearErrors(path as never);
      for (const [path, field] of Object.entries(held)) form.setError(path as never, { type: 'held', message: field.message });
      heldPaths.current = Object.keys(held);
      setHeldCount(heldPaths.current.length);
    },
    [form],
  );
  useEffect(() => markHeld(start.held), [markHeld, start.held]);

  const autosave = useAutosave({
    initialDraftId: props.draft?.id ?? null,
    fixSlug: props.fixSlug,
    getValues,
    getRefs: () => refsRef.current,
    onSaved: (saved) => {
      if (!props.fixSlug && !new URLSearchParams(window.location.search).has('draft'))
        window.history.replaceState(null, '', `/write?draft=${saved.revision.id}`);
      setBaseNote(saved.baseIsStale ? 'The live fix changed since this draft was started; submitting will show both versions.' : null);
      markHeld(saved.revision.held ?? {});
    },
    onRefused: (failure) => {
      for (const [path, messages] of Object.entries(failure.fields)) form.setError(path as never, { type: 'server', message: messages[0] });
      setSummary({ title: `Not saved: ${failure.message}`, items: serverFieldItems(failure.fields) });
    },
  });
  const { markEdited } = autosave;

  // Every change the writer makes (inputs, lists, chips, the remedy) is one edit for autosave and the journal.
  useEffect(() => {
    const subscription = form.watch((_values, info) => {
      if (info.name !== undefined) markEdited();
    });
    if (start.restored) markEdited();
    return () => subscription.unsubscribe();
  }, [form, markEdited, start.restored]);

  const setTargets = (next: { machines: LabelledRefData[]; chassis: LabelledRefData[] }) => {
    setMachines(next.machines);
    setChassis(next.chassis);
    setValue(
      'machineIds',
      next.machines.map((m) => m.id),
      { shouldDirty: true },
    );
    setValue(
      'chassisIds',
      next.chassis.map((c) => c.id),
      { shouldDirty: true },
    );
  };
  const setPhotoList = (next: PhotoRefData[]) => {
    setPhotos(next);
    setValue(
      'photoIds',
      next.map((p) => p.id),
      { shouldDirty: true },
    );
  };
  const onPhotoReady = (photo: PhotoRefData, insert: boolean) => {
    setPhotos((current) => {
      const next = current.some((p) => p.id === photo.id) ? current : [...current, photo];
      setValue(
        'photoIds',
        next.map((p) => p.id),
        { shouldDirty: true },
      );
      return next;
    });
    if (insert && editorRef.current) insertFigure(editorRef.current, photo);
    else if (insert) pendingInserts.current.push(photo);
  };
  const onEditorReady = useCallback((editor: Editor) => {
    editorRef.current = editor;
    for (const photo of pendingInserts.current.splice(0)) insertFigure(editor, photo);
  }, []);
  const onBodyChange = useCallback((doc: BodyDoc) => setValue('body', doc, { shouldDirty: true }), [setValue]);

  const submission = useSubmission({ form, autosave, doneHref: props.doneHref, setSummary, labels: { machines, chassis, photos } });
  const takeLive = (live: EditorRevisionData, fields: (keyof FixDraftInput)[]) => {
    for (const field of fields) setValue(field, live.values[field] as never, { shouldDirty: true });
    if (fields.includes('machineIds')) {
      setMachines(live.machines);
      setChassis(live.chassis);
    }
    if (fields.includes('photoIds')) setPhotos(live.photos);
    if (fields.includes('body')) editorRef.current?.commands.setContent(live.values.body as BodyDoc);
  };

  const errors = formState.errors;
  return (
    <form className="grid gap-8" noValidate onSubmit={submission.submit} onKeyDown={keepEnterFromSubmitting}>
      <div className="sticky top-0 z-20 flex flex-wrap items-center justify-between gap-3 border-b border-rule bg-paper py-2">
        <SaveIndicator state={autosave.state} journalFailed={autosave.journalFailed} heldCount={heldCount} />
        <button type="submit" className="btn" disabled={submission.busy}>
          {submission.busy ? 'Submitting…' : 'Submit for proofing'}
        </button>
      </div>
      {props.notice && <p className="rounded bg-teal-wash p-3 font-sans text-sm">{props.notice}</p>}
      {start.restored && (
        <p className="rounded bg-amber-wash p-3 font-sans text-sm" role="status">
          Restored changes you made in this browser at {new Date(start.restored).toLocaleTimeString()} that had not reached the server; they
          are being saved now.
        </p>
      )}
      {baseNote && <p className="rounded bg-amber-wash p-3 font-sans text-sm">{baseNote}</p>}
      {summary && <ErrorSummary title={summary.title} items={summary.items} tone={summary.tone ?? 'error'} />}
      {submission.conflict && (
        <Suspense fallback={<p className="font-sans text-sm">Loading the comparison…</p>}>
          <LazyStaleBasePanel
            live={submission.conflict}
            yours={{ values: getValues() as FixDraft, machines, chassis, photos }}
            onTakeLive={(section) => takeLive(submission.conflict!, sectionFields[section])}
            onRebase={() => void submission.rebase()}
            merge={submission.merge}
            onCombine={() => {
              takeLive(submission.conflict!, submission.merge?.theirs ?? []);
              void submission.rebase(
                `Combined: your changes on r${submission.conflict!.number} with its own. The form shows the result; check it, then submit again.`,
              );
            }}
            busy={submission.busy}
          />
        </Suspense>
      )}

      <Field
        id="field-title"
        label="Title"
        hint="The symptom and the machine family in a few words, e.g. “Tray opens, then closes again at once”."
        error={errors.title?.message}
      >
        {(a) => <input {...a} className="input w-full font-serif text-xl" maxLength={fixDraftLimits.title} {...register('title')} />}
      </Field>
      <AppliesTo
        machines={machines}
        chassis={chassis}
        onChange={setTargets}
        error={errors.machineIds?.message ?? errors.chassisIds?.message}
      />
      <div>
        <Controller
          control={control}
          name="symptoms"
          render={({ field }) => (
            <ListField
              id="field-symptoms"
              legend="Symptoms"
              itemLabel="symptom"
              hint="What the owner sees or hears, one per line."
              values={field.value ?? []}
              onChange={field.onChange}
              maxItems={fixDraftLimits.symptoms}
              maxLength={fixDraftLimits.symptom}
              error={errors.symptoms?.message}
            />
          )}
        />
        <SimilarFixes control={control} machines={machines} chassis={chassis} editingSlug={props.fixSlug} />
      </div>
      <Controller
        control={control}
        name="errorCodes"
        render={({ field }) => (
          <ListField
            id="field-errorCodes"
            legend="Error codes on the display"
            itemLabel="error code"
            hint="As shown, e.g. E21 or U-07; leave empty if none."
            values={field.value ?? []}
            onChange={field.onChange}
            maxItems={fixDraftLimits.errorCodes}
            maxLength={fixDraftLimits.errorCode}
            error={errors.errorCodes?.message}
            mono
          />
        )}
      />
      <Field id="field-cause" label="Cause" hint="What is physically wrong, in a sentence or two." error={errors.cause?.message}>
        {(a) => <textarea {...a} className="input w-full" rows={3} maxLength={fixDraftLimits.cause} {...register('cause')} />}
      </Field>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="field-difficulty" label="Difficulty" error={errors.difficulty?.message}>
          {(a) => (
            <select {...a} className="input" {...register('difficulty', { setValueAs: (v: string) => (v === '' ? null : v) })}>
              <option value="">Not given</option>
              {difficulties.map((d) => (
                <option key={d} value={d}>
                  {difficultyLabels[d]}
                </option>
              ))}
            </select>
          )}
        </Field>
        <Field id="field-timeMinutes" label="Bench time in minutes" error={errors.timeMinutes?.message}>
          {(a) => (
            <input
              {...a}
              type="number"
              min={1}
              max={10000}
              className="input w-32"
              {...register('timeMinutes', { setValueAs: (v: string) => (v === '' || v === null ? null : Number(v)) })}
            />
          )}
        </Field>
      </div>
      <CautionsEditor control={control} register={register} errors={errors} />
      <div id="field-body" className="grid gap-2">
        <h2 className="font-sans font-semibold">Remedy</h2>
        <p className="font-sans text-sm text-ink-soft">
          The steps, in order. Put caution boxes before the steps they guard. Paste from a word processor keeps lists and tables; pasted
          pictures are uploaded as photos.
        </p>
        <Suspense fallback={<RemedyLoading />}>
          <LazyBodyEditor
            initial={start.values.body}
            onChange={onBodyChange}
            photos={photos}
            onImageFiles={(files) => setIncoming({ files, insert: true, batch: Date.now() })}
            onReady={onEditorReady}
            error={errors.body?.message}
          />
        </Suspense>
      </div>
      <PartsEditor control={control} register={register} errors={errors} />
      <ReadingsEditor control={control} register={register} errors={errors} />
      <section className="grid gap-3" aria-labelledby="photos-title">
        <h2 id="photos-title" className="font-sans font-semibold">
          Photos
        </h2>
        <PhotoList
          photos={photos}
          onRemove={(id) => setPhotoList(photos.filter((p) => p.id !== id))}
          onInsert={(photo) => editorRef.current && insertFigure(editorRef.current, photo)}
          onMove={(id, by) => {
            const i = photos.findIndex((p) => p.id === id);
            const next = [...photos];
            const [moved] = next.splice(i, 1);
            if (moved) next.splice(Math.max(0, i + by), 0, moved);
            setPhotoList(next);
          }}
        />
        <PhotoUploader onReady={onPhotoReady} incoming={incoming} />
      </section>
      <Field
        id="field-editSummary"
        label="What you changed, for the proofer"
        hint="One line, e.g. “Added the second capacitor and a reading at TP4”."
        error={errors.editSummary?.message}
      >
        {(a) => <input {...a} className="input w-full" maxLength={fixDraftLimits.editSummary} {...register('editSummary')} />}
      </Field>
    </form>
  );
}
