// The structured fields of a revision: parts rows, readings, cautions, difficulty. One schema for all sides.
import { z } from 'zod';
import { cautionKinds, difficulties, partKinds } from './revision-values';

// The kinds and their labels live apart from zod, so the editor paints without it.
export { cautionKinds, cautionLabels, difficulties, difficultyLabels, partKinds } from './revision-values';

export const cautionKindSchema = z.enum(cautionKinds, { error: 'Pick the hazard from the list, e.g. mains voltage.' });
export type CautionKind = z.infer<typeof cautionKindSchema>;

export const difficultySchema = z.enum(difficulties, { error: 'Pick a difficulty from the list, e.g. “Careful: some disassembly”.' });
export type Difficulty = z.infer<typeof difficultySchema>;

export const partKindSchema = z.enum(partKinds, { error: 'Pick the kind of part from the list, e.g. capacitor or belt.' });
export type PartKind = z.infer<typeof partKindSchema>;

export const partRowSchema = z.object({
  /** Reference designator on the board, e.g. C512; empty for mechanical parts without one. */
  ref: z.string().trim().max(40).default(''),
  kind: partKindSchema,
  /** Value as written: "470uF", "2k2", "belt 92 mm x 4 mm flat". */
  value: z.string().trim().min(1, 'Give the part value, e.g. 470uF or 2k2.').max(120),
  /** Rating: voltage, temperature class, wattage, size: "16V 105C", "0.25W". */
  rating: z.string().trim().max(120).default(''),
  quantity: z.number().int().min(1, 'Quantity is at least 1.').max(999),
  notes: z.string().trim().max(500).default(''),
});
export type PartRow = z.infer<typeof partRowSchema>;

export const readingSchema = z.object({
  testPoint: z.string().trim().min(1, 'Name the test point, e.g. TP12 or the 5 V rail at C512.').max(120),
  expected: z.string().trim().min(1, 'Give the expected value, e.g. 5.0 V.').max(80),
  /** What a faulty unit typically shows; optional. */
  measured: z.string().trim().max(80).default(''),
  note: z.string().trim().max(300).default(''),
});
export type Reading = z.infer<typeof readingSchema>;

export const cautionSchema = z.object({
  kind: cautionKindSchema,
  /** What this fix in particular asks the reader to watch for. */
  detail: z
    .string({ error: 'Describe the hazard in words, e.g. “The primary capacitor holds 320 V after unplugging”.' })
    .trim()
    .max(600, 'A caution’s detail is at most 600 characters, e.g. “The primary capacitor holds 320 V after unplugging”.')
    .default(''),
});
export type Caution = z.infer<typeof cautionSchema>;

export const revisionStates = ['draft', 'submitted', 'proofed', 'returned', 'withdrawn'] as const;
export const revisionStateSchema = z.enum(revisionStates);
export type RevisionState = z.infer<typeof revisionStateSchema>;
