// Applying a fix to a job sheet: the fix by its address, and the revision to pin (its live one when absent).
import { z } from 'zod';
import { fixSlugSchema } from './slug';

/** Applying a fix to a job pins the fix's live revision (or the one named). */
export const applyFixSchema = z.object({
  fix: fixSlugSchema,
  revision: z.number().int('The revision is a whole number.').min(1, 'Revisions start at r1.').optional(),
});
export type ApplyFixInput = z.input<typeof applyFixSchema>;
export type ApplyFix = z.output<typeof applyFixSchema>;
