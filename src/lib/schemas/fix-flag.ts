// A moderator locking a fix against edits or hiding it from readers, and undoing either.
import { z } from 'zod';

export const fixFlagActions = ['lock', 'unlock', 'hide', 'unhide'] as const;
export type FixFlagAction = (typeof fixFlagActions)[number];

export const fixFlagSchema = z.object(
  {
    action: z.enum(fixFlagActions, { error: 'Choose lock, unlock, hide or unhide.' }),
    note: z.string({ error: 'Write the note as text.' }).trim().max(2000, 'Keep the note under 2000 characters.').default(''),
  },
  { error: 'Send the action (lock, unlock, hide or unhide) and an optional note.' },
);
export type FixFlagInput = z.input<typeof fixFlagSchema>;
export type FixFlag = z.output<typeof fixFlagSchema>;
