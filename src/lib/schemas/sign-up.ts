// Joining: name, e-mail, a new password and an optional shop name.
import { z } from 'zod';
import { displayNameSchema, emailSchema, newPasswordSchema, shopNameSchema } from './account-fields';

export const signUpSchema = z.object({
  name: displayNameSchema,
  email: emailSchema,
  password: newPasswordSchema,
  shopName: shopNameSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;
export type SignUpFields = z.input<typeof signUpSchema>;
