// Signing in with e-mail and password, and where to go afterwards.
import { z } from 'zod';
import { currentPasswordSchema, emailSchema, nextPathSchema } from './account-fields';

export const signInSchema = z.object({
  email: emailSchema,
  password: currentPasswordSchema,
  next: nextPathSchema.optional(),
});
export type SignInInput = z.infer<typeof signInSchema>;
export type SignInFields = z.input<typeof signInSchema>;
