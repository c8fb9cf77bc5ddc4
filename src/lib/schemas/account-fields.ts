// The fields every account form is built from: e-mail, passwords, names, the next path and our link tokens.
import { z } from 'zod';
import { isLocalPath } from '../local-path';

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

/** Our own tokens are 32 random bytes in base64url: 43 characters. */
export const tokenSchema = z
  .string({ error: 'This link is incomplete.' })
  .regex(/^[A-Za-z0-9_-]{43}$/, { error: 'This link is incomplete or has been changed.' });

/** A member picked in the admin's user list, by id. */
export const userIdSchema = z.coerce.number({ error: 'Choose a member.' }).int().positive({ error: 'Choose a member.' });
