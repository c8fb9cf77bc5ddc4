// Changing the password from the account page (the current one when there is one).
import { z } from 'zod';
import { currentPasswordSchema, newPasswordSchema } from './account-fields';

export const passwordChangeSchema = z.object({
  currentPassword: currentPasswordSchema.optional(),
  newPassword: newPasswordSchema,
});
export type PasswordChangeInput = z.infer<typeof passwordChangeSchema>;
export type PasswordChangeFields = z.input<typeof passwordChangeSchema>;
