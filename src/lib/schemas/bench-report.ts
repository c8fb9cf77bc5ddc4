// A bench report: what happened when a member followed a fix on the bench. One schema for form, API and island.
import { z } from 'zod';
import { readingSchema } from './revision';
import { fixSlugSchema, slugSchema } from './slug';

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

const machineSlug = z.string({ error: 'Choose the machine you repaired.' }).pipe(slugSchema);

export const benchReportInputSchema = z
  .object({
    fix: fixSlugSchema,
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
