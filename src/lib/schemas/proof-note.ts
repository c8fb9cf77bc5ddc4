// The note a moderator leaves when proofing a revision (optional) or returning it to its author (required).
import { z } from 'zod';

export const MAX_PROOF_NOTE = 2000;

export const proofNoteSchema = z
  .string({ error: 'Write the note as text.' })
  .trim()
  .max(MAX_PROOF_NOTE, `The note is at most ${MAX_PROOF_NOTE} characters.`);
export type ProofNoteInput = z.input<typeof proofNoteSchema>;
export type ProofNote = z.output<typeof proofNoteSchema>;
