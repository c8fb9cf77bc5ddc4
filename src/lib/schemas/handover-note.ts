// A hand-over note: what the customer is told about the repair, from a fix and optionally a job sheet.
import { z } from 'zod';
import { fixSlugSchema } from './slug';

const partLine = z.string().trim().min(1, 'A part line cannot be empty.').max(200, 'Keep each part under 200 characters.');

export const handoverNoteInputSchema = z.object({
  fix: fixSlugSchema,
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
