// Reads the job sheet forms and carries out their buttons (save, apply or remove a fix, delete) for the pages.
import { fieldErrors } from '../http/responses';
import { refuse, succeed, type Failure, type Outcome } from '../http/result';
import { applyFixToJob, deleteJobSheet, removeFixFromJob, updateJobSheet } from './job-sheets';
import { putJobPartsOnOrderList, takePartsFromOrderList } from './job-sheet-parts';
import { fixRefFromText, formNumber, formRows, formText, type FormFields } from '@/lib/form-fields';
import { jobSheetCreateSchema, jobSheetPatchSchema } from '@/lib/schemas/job-sheet';

export const partFields = ['ref', 'kind', 'value', 'rating', 'quantity', 'notes', 'source'] as const;

/** The fields of the job sheet form in the shape the schemas check; blank part rows are dropped. */
export function jobSheetFromForm(form: FormFields): Record<string, unknown> {
  return {
    customerRef: formText(form, 'customerRef') ?? '',
    machine: formText(form, 'machine') ?? null,
    serialNumber: formText(form, 'serialNumber') ?? '',
    reportedSymptom: formText(form, 'reportedSymptom') ?? '',
    findings: formText(form, 'findings') ?? '',
    labourMinutes: formNumber(form, 'labourMinutes') ?? 0,
    status: formText(form, 'status') ?? 'booked_in',
    outcome: formText(form, 'outcome') ?? '',
    partsUsed: formRows(form, 'parts', partFields).map((row) => ({
      ...row,
      quantity: row.quantity === '' ? Number.NaN : Number(row.quantity),
    })),
  };
}

/** Where the page goes after a button, or why not (the typed values ride in `detail.values`). */
export type JobFormOutcome = Outcome<{ location: string }>;

const problem = (message: string, fields: Record<string, string[]> = {}, values?: Record<string, unknown>): Failure =>
  refuse('bad_request', message, fields, values ? { values } : undefined);

const goTo = (location: string): JobFormOutcome => succeed({ location });

/** The new-sheet form: validated input, or the messages to show beside the fields. */
export function parseNewJobSheet(form: FormFields): Outcome<ReturnType<typeof jobSheetCreateSchema.parse>> {
  const values = jobSheetFromForm(form);
  const parsed = jobSheetCreateSchema.safeParse(values);
  if (parsed.success) return succeed(parsed.data);
  return problem('Please correct the fields marked below.', fieldErrors(parsed.error), values);
}

/** One button of the job sheet page, chosen by its `intent`. */
export async function handleJobSheetPost(ownerId: number, id: number, form: FormFields): Promise<JobFormOutcome> {
  const intent = formText(form, 'intent');
  const here = `/jobs/${id}`;
  if (intent === 'save') {
    const values = jobSheetFromForm(form);
    const parsed = jobSheetPatchSchema.safeParse(values);
    if (!parsed.success)
      return problem('The job sheet was not saved: please correct the fields marked below.', fieldErrors(parsed.error), values);
    const saved = await updateJobSheet(ownerId, id, parsed.data);
    if (!saved.ok) return saved.code === 'not_found' ? refuse('not_found', saved.message) : problem(saved.message, saved.fields, values);
    return goTo(`${here}?job=saved`);
  }
  if (intent === 'apply_fix') {
    const ref = fixRefFromText(formText(form, 'fixLink') ?? formText(form, 'fix'));
    if (!ref) return problem('Choose a fix, or paste its address or link.', { fix: ['Choose a fix, or paste its address or link.'] });
    const applied = await applyFixToJob(ownerId, id, ref.slug, ref.revision);
    if (!applied.ok) return problem(applied.message, applied.fields);
    return goTo(`${here}?job=fix_applied#applied-fixes`);
  }
  if (intent === 'remove_fix') {
    await removeFixFromJob(ownerId, id, formText(form, 'fix') ?? '');
    return goTo(`${here}?job=fix_removed#applied-fixes`);
  }
  if (intent === 'take_order_list') {
    const taken = await takePartsFromOrderList(ownerId, id, { clear: formText(form, 'clear') === 'yes' });
    if (!taken.ok) return problem(taken.message, { orderList: [taken.message] });
    return goTo(`${here}?job=parts_taken#parts-used`);
  }
  if (intent === 'to_order_list') {
    const listed = await putJobPartsOnOrderList(ownerId, id);
    if (!listed.ok) return problem(listed.message, { orderList: [listed.message] });
    return goTo(`${here}?job=parts_listed#order-list-heading`);
  }
  if (intent === 'delete') {
    if (formText(form, 'confirm') !== 'yes')
      return problem('Tick the box to confirm that the job sheet and its customer data should be deleted.', {
        confirm: ['Tick to confirm.'],
      });
    await deleteJobSheet(ownerId, id);
    return goTo('/jobs?job=deleted');
  }
  return problem('That button is not one this page knows.');
}
