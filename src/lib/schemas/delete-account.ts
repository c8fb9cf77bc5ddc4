// Deleting the account: the password when there is one, and the word delete typed to confirm.
import { z } from 'zod';
import { currentPasswordSchema } from './account-fields';

export const deleteAccountSchema = z.object({
  password: currentPasswordSchema.optional(),
  confirm: z.literal('delete', { error: 'Type the word delete to confirm.' }),
});
export type DeleteAccountInput = z.infer<typeof deleteAccountSchema>;
export type DeleteAccountFields = z.input<typeof deleteAccountSchema>;
