// Account forms and endpoints: one set of zod schemas for the server and any client code.
import { z } from 'zod';
import { isLocalPath } from '../local-path';
import { roles } from '../permissions';

export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 256;

/** Printable text only: control characters never belong in a name. */
const noControlCharacters = /^[^\p{Cc}\p{Cf}]*$/u;

export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .min(1, { error: 'Enter your e-mail address.' })
  .max(254, { error: 'An e-mail address has at most 254 characters.' })
  .pipe(z.email({ error: 'Enter an e-mail address such as name@example.org.' }));

/** A password being chosen: length here; the server also refuses ones that are easy to guess. */
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(PASSWORD_MIN, { error: `Use at least ${PASSWORD_MIN} characters.` })
  .max(PASSWORD_MAX, { error: `Use at most ${PASSWORD_MAX} characters.` });

/** A password being typed to prove who you are: only bounded, never judged. */
export const currentPasswordSchema = z
  .string({ error: 'Enter your password.' })
  .min(1, { error: 'Enter your password.' })
  .max(PASSWORD_MAX, { error: `A password has at most ${PASSWORD_MAX} characters.` });

export const displayNameSchema = z
  .string({ error: 'Enter the name other members will see.' })
  .trim()
  .min(2, { error: 'Use at least 2 characters for your name.' })
  .max(80, { error: 'Use at most 80 characters for your name.' })
  .regex(noControlCharacters, { error: 'Use letters, digits, spaces and punctuation only.' });

/** Optional: an empty field means "no shop name". */
export const shopNameSchema = z
  .string()
  .trim()
  .max(120, { error: 'Use at most 120 characters for the shop name.' })
  .regex(noControlCharacters, { error: 'Use letters, digits, spaces and punctuation only.' })
  .optional()
  .transform((value) => (value ? value : null));

/** Where to go after signing in: a path on this site only, never another origin. */
export const nextPathSchema = z
  .string()
  .refine(isLocalPath, { error: 'Not a path on this site; use one such as /fixes or /account.' })
  .catch('/');

export const signUpSchema = z.object({
  name: displayNameSchema,
  email: emailSchema,
  password: newPasswordSchema,
  shopName: shopNameSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: currentPasswordSchema,
  next: nextPathSchema.optional(),
});
export type SignInInput = z.infer<typeof signInSchema>;

/** Asking for a sign-in link, a reset link, or a new confirmation mail. */
export const emailRequestSchema = z.object({ email: emailSchema, next: nextPathSchema.optional() });
export type EmailRequestInput = z.infer<typeof emailRequestSchema>;

/** Our own tokens are 32 random bytes in base64url: 43 characters. */
export const tokenSchema = z
  .string({ error: 'This link is incomplete.' })
  .regex(/^[A-Za-z0-9_-]{43}$/, { error: 'This link is incomplete or has been changed.' });

export const resetPasswordSchema = z.object({ token: tokenSchema, password: newPasswordSchema });
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;

export const profileSchema = z.object({ name: displayNameSchema, shopName: shopNameSchema });
export type ProfileInput = z.infer<typeof profileSchema>;

export const passwordChangeSchema = z.object({
  currentPassword: currentPasswordSchema.optional(),
  newPassword: newPasswordSchema,
});
export type PasswordChangeInput = z.infer<typeof passwordChangeSchema>;

/** A new address for the account; the change waits for the link mailed to it. */
export const emailChangeSchema = z.object({
  newEmail: emailSchema,
  currentPassword: currentPasswordSchema.optional(),
});
export type EmailChangeInput = z.infer<typeof emailChangeSchema>;

export const deleteAccountSchema = z.object({
  password: currentPasswordSchema.optional(),
  confirm: z.literal('delete', { error: 'Type the word delete to confirm.' }),
});
export type DeleteAccountInput = z.infer<typeof deleteAccountSchema>;

const userIdSchema = z.coerce.number({ error: 'Choose a member.' }).int().positive({ error: 'Choose a member.' });

export const roleChangeSchema = z.object({
  userId: userIdSchema,
  role: z.enum(roles, { error: 'Choose one of: member, editor, moderator, admin.' }),
});

export const suspendSchema = z.object({
  userId: userIdSchema,
  reason: z
    .string({ error: 'Give a reason: the member is shown it.' })
    .trim()
    .min(3, { error: 'Give a reason of at least 3 characters: the member is shown it.' })
    .max(500, { error: 'Keep the reason under 500 characters.' }),
});

export const unsuspendSchema = z.object({ userId: userIdSchema });

export const userSearchSchema = z.object({
  q: z.string().trim().max(200, { error: 'Search with at most 200 characters.' }).optional(),
  page: z.coerce.number().int().min(1, { error: 'Pages start at 1.' }).max(10_000).optional(),
});
