// A moderator closing a member's report on a fix: resolved (acted on) or dismissed (nothing to do).
import { z } from 'zod';

export const resolutionSchema = z.object(
  {
    outcome: z.enum(['resolved', 'dismissed'], { error: 'Choose to resolve or dismiss the report.' }),
    note: z.string({ error: 'Write the note as text.' }).trim().max(2000, 'Keep the note under 2000 characters.').default(''),
  },
  { error: 'Send the outcome (resolved or dismissed) and an optional note.' },
);
export type ResolutionInput = z.input<typeof resolutionSchema>;
export type Resolution = z.output<typeof resolutionSchema>;
