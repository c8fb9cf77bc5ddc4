// An admin suspending a member, with the reason the member is shown.
import { z } from 'zod';
import { userIdSchema } from './account-fields';

export const suspendSchema = z.object({
  userId: userIdSchema,
  reason: z
    .string({ error: 'Give a reason: the member is shown it.' })
    .trim()
    .min(3, { error: 'Give a reason of at least 3 characters: the member is shown it.' })
    .max(500, { error: 'Keep the reason under 500 characters.' }),
});
export type SuspendInput = z.input<typeof suspendSchema>;
export type Suspend = z.output<typeof suspendSchema>;
