// Bench work inputs: bench reports, hand-over notes and job sheets. One schema for form, API and island.
import { z } from 'zod';
import { readingSchema } from './revision';
import { slugSchema } from './slug';
import { orderLineInputSchema } from '@/lib/bench/order-list';
import { MAX_JOB_PARTS } from '@/lib/bench/job-parts';

export const benchOutcomes = ['fixed', 'partly', 'not_fixed', 'came_back'] as const;
export const benchOutcomeSchema = z.enum(benchOutcomes, { error: 'Choose an outcome: fixed, partly, not fixed or fault came back.' });
export type BenchOutcome = z.infer<typeof benchOutcomeSchema>;

export const benchOutcomeLabels: Record<BenchOutcome, string> = {
  fixed: 'Fixed',
  partly: 'Partly fixed',
  not_fixed: 'Not fixed',
  came_back: 'Fault came back',
};

/** A bench report's note may carry a technician's whole write-up: readings, steps, what came back. */
export const MAX_BENCH_NOTE = 30_000;

const fixSlug = z.string({ error: 'Name the fix by its address.' }).pipe(slugSchema);
const machineSlug = z.string({ error: 'Choose the machine you repaired.' }).pipe(slugSchema);

export const benchReportInputSchema = z
  .object({
    fix: fixSlug,
    machine: machineSlug,
    /** The proofed revision followed on the bench (a job sheet pins one); the live revision when absent. */
    revision: z.number().int('The revision is a whole number.').min(1, 'Revisions start at r1.').optional(),
    outcome: benchOutcomeSchema,
    /** Only for "came back": how many days the repair held before the fault returned. */
    heldDays: z
      .number({ error: 'Give the number of days the repair held.' })
      .int('Give whole days.')
      .min(0, 'Days cannot be negative.')
      .max(36_500, 'That is more than a hundred years.')
      .nullable()
      .default(null),
    note: z
      .string()
      .trim()
      .max(MAX_BENCH_NOTE, `Keep the note under ${MAX_BENCH_NOTE} characters, e.g. the readings and what you changed.`)
      .default(''),
    readings: z.array(readingSchema).max(20, 'Record at most 20 readings.').default([]),
  })
  .superRefine((report, ctx) => {
    if (report.outcome === 'came_back' && report.heldDays === null) {
      ctx.addIssue({ code: 'custom', path: ['heldDays'], message: 'Say how many days the repair held before the fault came back.' });
    }
    if (report.outcome !== 'came_back' && report.heldDays !== null) {
      ctx.addIssue({ code: 'custom', path: ['heldDays'], message: 'Days held only apply when the fault came back.' });
    }
  });
export type BenchReportInput = z.input<typeof benchReportInputSchema>;
export type BenchReportData = z.output<typeof benchReportInputSchema>;

const partLine = z.string().trim().min(1, 'A part line cannot be empty.').max(200, 'Keep each part under 200 characters.');

export const handoverNoteInputSchema = z.object({
  fix: fixSlug,
  /** The proofed revision the repair followed; the fix's live revision when absent. */
  revision: z.number().int('The revision is a whole number.').min(1, 'Revisions start at r1.').optional(),
  jobSheetId: z.number().int().positive().nullable().default(null),
  /** Shown to the customer only when the member ticks it. */
  includeJobDetails: z.boolean().default(false),
  /** Defaults to the member's shop name from their account. */
  shopName: z.string().trim().max(120, 'Keep the shop name under 120 characters.').nullable().default(null),
  message: z.string().trim().max(2000, 'Keep the message under 2000 characters.').default(''),
  partsReplaced: z.array(partLine).max(40, 'List at most 40 parts.').default([]),
  warranty: z.string().trim().max(300, 'Keep the warranty line under 300 characters.').default(''),
});
export type HandoverNoteInput = z.input<typeof handoverNoteInputSchema>;
export type HandoverNoteData = z.output<typeof handoverNoteInputSchema>;

/** What may change on a note once written: the words around the fix, never the fix or revision it is pinned to. */
export const handoverNotePatchSchema = handoverNoteInputSchema
  .pick({ includeJobDetails: true, shopName: true, message: true, partsReplaced: true, warranty: true })
  .partial()
  .strict();
export type HandoverNotePatch = z.output<typeof handoverNotePatchSchema>;

export const jobStatuses = ['booked_in', 'diagnosing', 'waiting_for_parts', 'repaired', 'collected', 'returned_unrepaired'] as const;
export const jobStatusSchema = z.enum(jobStatuses, { error: 'Choose a status from the list.' });
export type JobStatus = z.infer<typeof jobStatusSchema>;

export const jobStatusLabels: Record<JobStatus, string> = {
  booked_in: 'Booked in',
  diagnosing: 'Diagnosing',
  waiting_for_parts: 'Waiting for parts',
  repaired: 'Repaired',
  collected: 'Collected',
  returned_unrepaired: 'Returned unrepaired',
};

/** A part used on a job: the order list's line shape; the source is filled in from the job sheet. */
export const jobPartSchema = orderLineInputSchema.extend({
  source: z.string().trim().max(200).default(''),
});
export type JobPart = z.output<typeof jobPartSchema>;

const jobSheetFields = {
  customerRef: z
    .string({ error: 'Give a customer reference, e.g. an invoice or ticket number.' })
    .trim()
    .min(1, 'Give a customer reference, e.g. an invoice or ticket number.')
    .max(120, 'Keep the customer reference under 120 characters.'),
  /** A machine from the catalogue by its slug, or null when it is not in the catalogue. */
  machine: slugSchema.nullable(),
  serialNumber: z.string().trim().max(80, 'Keep the serial number under 80 characters.'),
  reportedSymptom: z.string().trim().max(2000, 'Keep the reported symptom under 2000 characters.'),
  findings: z.string().trim().max(4000, 'Keep the findings under 4000 characters.'),
  partsUsed: z.array(jobPartSchema).max(MAX_JOB_PARTS, `A job sheet holds at most ${MAX_JOB_PARTS} part lines.`),
  labourMinutes: z
    .number({ error: 'Give labour in whole minutes.' })
    .int('Give labour in whole minutes.')
    .min(0, 'Labour cannot be negative.')
    .max(100_000, 'Labour above 100000 minutes is not one job.'),
  status: jobStatusSchema,
  outcome: z.string().trim().max(2000, 'Keep the outcome under 2000 characters.'),
};

export const jobSheetCreateSchema = z.object({
  customerRef: jobSheetFields.customerRef,
  machine: jobSheetFields.machine.default(null),
  serialNumber: jobSheetFields.serialNumber.default(''),
  reportedSymptom: jobSheetFields.reportedSymptom.default(''),
  findings: jobSheetFields.findings.default(''),
  partsUsed: jobSheetFields.partsUsed.default([]),
  labourMinutes: jobSheetFields.labourMinutes.default(0),
  status: jobSheetFields.status.default('booked_in'),
  outcome: jobSheetFields.outcome.default(''),
});
export type JobSheetCreate = z.output<typeof jobSheetCreateSchema>;

export const jobSheetPatchSchema = z.object(jobSheetFields).partial();
export type JobSheetPatch = z.output<typeof jobSheetPatchSchema>;

/** Applying a fix to a job pins the fix's live revision (or the one named). */
export const applyFixSchema = z.object({
  fix: fixSlug,
  revision: z.number().int().min(1).optional(),
});

export const jobSheetSorts = ['updated', 'booked', 'customer', 'status'] as const;
export const jobSheetListQuerySchema = z.object({
  status: jobStatusSchema.optional(),
  q: z.string().trim().max(120).optional(),
  sort: z.enum(jobSheetSorts).default('updated'),
});
export type JobSheetListQuery = z.output<typeof jobSheetListQuerySchema>;

/** The API's list: the same filters, a page at a time (page from 1, up to 100 a page). */
export const jobSheetPagedQuerySchema = jobSheetListQuerySchema.extend({
  page: z.coerce
    .number({ error: 'Give the page as a whole number, e.g. 2.' })
    .int('Give the page as a whole number, e.g. 2.')
    .min(1, 'Pages start at 1.')
    .max(10_000, 'Pages stop at 10000.')
    .default(1),
  perPage: z.coerce
    .number({ error: 'Give perPage as a whole number, e.g. 50.' })
    .int('Give perPage as a whole number, e.g. 50.')
    .min(1, 'Ask for at least 1 per page, e.g. 50.')
    .max(100, 'Ask for at most 100 per page, e.g. 50.')
    .default(50),
});

/** What the form readers need of a submitted form: FormData and URLSearchParams both have it. */
export interface FormFields {
  get(name: string): FormDataEntryValue | null;
  keys(): IterableIterator<string> | Iterable<string>;
}

/** Plain HTML forms send text: a trimmed value, or undefined when the field is missing or blank. */
export function formText(form: FormFields, name: string): string | undefined {
  const value = form.get(name);
  if (typeof value !== 'string') return undefined;
  const trimmed = value.trim();
  return trimmed === '' ? undefined : trimmed;
}

/** A number typed into a form: undefined when blank, NaN (which the schema names) when not a number. */
export function formNumber(form: FormFields, name: string): number | undefined {
  const text = formText(form, name);
  return text === undefined ? undefined : Number(text);
}

/**
 * Repeated rows of a form, named `prefix.0.field`, `prefix.1.field`, ...; rows left entirely blank are
 * dropped, so a form can offer a few empty rows for new entries without JavaScript.
 */
export function formRows(form: FormFields, prefix: string, fields: readonly string[]): Record<string, string>[] {
  const indexes = new Set<number>();
  for (const key of form.keys()) {
    const match = new RegExp(`^${prefix}\\.(\\d{1,3})\\.`).exec(key);
    if (match) indexes.add(Number(match[1]));
  }
  const rows: Record<string, string>[] = [];
  for (const index of [...indexes].sort((a, b) => a - b)) {
    const row: Record<string, string> = {};
    for (const field of fields) row[field] = formText(form, `${prefix}.${index}.${field}`) ?? '';
    if (Object.values(row).some((v) => v !== '')) rows.push(row);
  }
  return rows;
}

/**
 * A fix named the way a member has it to hand: its address ("tl2-tray-will-not-open-e21"), a link to it,
 * or a link to one revision ("https://.../fixes/<slug>/r/3"). Null when it names no fix.
 */
export function fixRefFromText(text: string | undefined): { slug: string; revision?: number } | null {
  if (!text) return null;
  const trimmed = text.trim();
  const linked = /\/fixes\/([a-z0-9]+(?:-[a-z0-9]+)*)(?:\/r\/(\d{1,6}))?\/?(?:[?#].*)?$/.exec(trimmed);
  if (linked?.[1]) return linked[2] ? { slug: linked[1], revision: Number(linked[2]) } : { slug: linked[1] };
  return slugSchema.safeParse(trimmed).success ? { slug: trimmed } : null;
}

/** The fields of a bench report form, kept exactly as typed so a refused form can show them again. */
export const benchFormFields = [
  'fix',
  'revision',
  'machine',
  'outcome',
  'heldDays',
  'note',
  ...[0, 1].flatMap((i) => ['testPoint', 'expected', 'measured'].map((f) => `readings.${i}.${f}`)),
] as const;

/** What a member typed into a bench report form, field by field, untrimmed. */
export type TypedForm = Record<string, string>;

/** The named fields of a posted form as typed (files and missing fields left out). */
export function typedFields(form: FormFields, names: readonly string[]): TypedForm {
  const typed: TypedForm = {};
  for (const name of names) {
    const value = form.get(name);
    if (typeof value === 'string') typed[name] = value;
  }
  return typed;
}

/**
 * The answer of a form Action, rendered by the page that posted it: saved, or refused with the message,
 * the messages by field and everything typed, so nothing travels through the address and nothing is lost.
 */
export type FormActionResult<Saved> =
  ({ saved: true } & Saved) | { saved: false; status: number; message: string; fields: Record<string, string[]>; typed: TypedForm };

/** What the page says after a saved bench report, by the fixed code in `?bench=`; nothing else is shown. */
export const benchSavedNotices: Record<string, string> = {
  saved: 'Your bench report is saved. Thank you: it counts towards the bench score.',
  saved_own: 'Your bench report is saved. As the author of this fix, your report is shown but not counted in its score.',
};

/** The sentence above a refused bench report form, by the field that was refused first. */
export function benchRefusal(fields: Record<string, string[]>): string {
  if (fields.heldDays) return 'The report was not saved: when the fault came back, say how many days the repair held, e.g. 30.';
  if (fields.machine) return 'The report was not saved: choose a machine this fix applies to, or one of its chassis family.';
  if (fields.revision) return 'The report was not saved: that revision of the fix cannot take reports.';
  if (fields.note) return `The report was not saved: the note is longer than ${MAX_BENCH_NOTE} characters.`;
  return 'The report was not saved: check the fields marked below.';
}
