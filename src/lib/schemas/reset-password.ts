// Choosing a new password from a reset link.
import { z } from 'zod';
import { newPasswordSchema, tokenSchema } from './account-fields';

export const resetPasswordSchema = z.object({ token: tokenSchema, password: newPasswordSchema });
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;
export type ResetPasswordFields = z.input<typeof resetPasswordSchema>;
