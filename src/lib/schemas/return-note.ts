// Returning a revision to its author always carries a note saying what to change.
import { z } from 'zod';
import { proofNoteSchema } from './proof-note';

export const returnNoteSchema = proofNoteSchema.pipe(
  z
    .string()
    .min(
      1,
      'Say what the author should change, for example “Give the polarity of C512 and the reading at TP12.” A returned revision always carries a note.',
    ),
);
export type ReturnNoteInput = z.input<typeof returnNoteSchema>;
export type ReturnNote = z.output<typeof returnNoteSchema>;
