// The bench side's own page forms: booking in a job sheet, the job sheet's buttons, writing a hand-over note
// and withdrawing one. A refusal renders on the page that posted it with everything typed.
import type { ActionAPIContext } from 'astro:actions';
import { handoverNoteInputSchema } from '@/lib/schemas/handover-note';
import { fieldErrors } from '@/lib/schemas/field-errors';
import { handleJobSheetPost, parseNewJobSheet } from '@/server/bench-work/job-form';
import { createJobSheet, getJobSheet } from '@/server/bench-work/job-sheets';
import { createHandoverNote, handoverNoteFromForm, revokeNote } from '@/server/bench-work/handover-notes';
import { idParam } from '@/server/http/endpoint';
import { runFormAction, type PageFormResult } from '@/server/http/forms';
import { consume } from '@/server/http/rate-limit';
import { refuse, succeed } from '@/server/http/result';

type Context = Pick<ActionAPIContext, 'locals'>;

/** A new job sheet from /jobs/new. */
export function submitNewJobForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'own_job_sheets', async (user, _fields, posted) => {
    const read = parseNewJobSheet(posted);
    if (!read.ok) return read;
    const created = await createJobSheet(user.id, read.value);
    if (!created.ok) return refuse(created.code, created.message, created.fields, { values: read.value });
    return succeed({ location: `/jobs/${created.value}?job=created` });
  });
}

/** One button of a job sheet (save, apply or remove a fix, parts to and from the order list, delete), by its `intent`. */
export function submitJobSheetForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'own_job_sheets', async (user, fields, posted) => {
    const id = idParam(fields.job);
    // Another member's sheet is answered like one that does not exist.
    if (!id || !(await getJobSheet(user.id, id))) return refuse('not_found', 'You have no job sheet with that number.');
    return handleJobSheetPost(user.id, id, posted);
  });
}

/** A hand-over note from /notes/new, pinned to the fix's live revision (or the one named). */
export function submitHandoverNoteForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'write_handover_note', async (user, _fields, posted) => {
    const values = handoverNoteFromForm(posted);
    const limit = await consume('note_create', { account: String(user.id) });
    if (!limit.ok) {
      const message = 'You have written many hand-over notes in a short time. Please wait a while and try again.';
      return refuse('too_many_requests', message, undefined, { values }, limit.retryAfterSeconds);
    }
    const parsed = handoverNoteInputSchema.safeParse(values);
    if (!parsed.success) return refuse('bad_request', 'Please correct the fields marked below.', fieldErrors(parsed.error), { values });
    const created = await createHandoverNote({ id: user.id, shopName: user.shopName }, parsed.data);
    if (created.ok) return succeed({ location: `/notes/${created.code}?note=created` });
    const fields = created.fields ?? (created.code === 'not_found' ? { fix: ['No live fix has that address.'] } : undefined);
    return refuse(created.code, created.message, fields, { values });
  });
}

/** Withdrawing one of your notes: its page then tells the customer so. */
export function submitWithdrawNoteForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'write_handover_note', async (user, fields) => {
    const code = fields.code ?? '';
    // Another member's code answers exactly like an unknown one.
    if ((await revokeNote(user.id, code)) === 'not_found') return refuse('not_found', 'You have no hand-over note with that code.');
    return succeed({ location: `/notes/${encodeURIComponent(code.toUpperCase())}?note=revoked` });
  });
}
