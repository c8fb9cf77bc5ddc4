// Asking for a sign-in link, a reset link or a new confirmation mail.
import { z } from 'zod';
import { emailSchema, nextPathSchema } from './account-fields';

export const emailRequestSchema = z.object({ email: emailSchema, next: nextPathSchema.optional() });
export type EmailRequestInput = z.infer<typeof emailRequestSchema>;
export type EmailRequestFields = z.input<typeof emailRequestSchema>;
