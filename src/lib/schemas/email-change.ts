// A new address for the account; the change waits for the link mailed to it.
import { z } from 'zod';
import { currentPasswordSchema, emailSchema } from './account-fields';

export const emailChangeSchema = z.object({
  newEmail: emailSchema,
  currentPassword: currentPasswordSchema.optional(),
});
export type EmailChangeInput = z.infer<typeof emailChangeSchema>;
export type EmailChangeFields = z.input<typeof emailChangeSchema>;
