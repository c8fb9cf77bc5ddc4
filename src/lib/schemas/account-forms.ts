// The account forms' checks, named once for the server handlers and the browser: each form's zod schema
// and the optional fields an empty input leaves out (so "optional" applies rather than "too short").
import type { z } from 'zod';
import { fieldErrors } from './field-errors';
import { deleteAccountSchema } from './delete-account';
import { emailChangeSchema } from './email-change';
import { emailRequestSchema } from './email-request';
import { passwordChangeSchema } from './password-change';
import { profileSchema } from './profile';
import { resetPasswordSchema } from './reset-password';
import { signInSchema } from './sign-in';
import { signUpSchema } from './sign-up';

interface FormCheck {
  schema: z.ZodType;
  optional: readonly string[];
}

export const accountFormChecks = {
  'sign-up': { schema: signUpSchema, optional: ['shopName'] },
  'sign-in': { schema: signInSchema, optional: [] },
  'email-request': { schema: emailRequestSchema, optional: [] },
  // The token travels in the page address; the form holds only the new password.
  'new-password': { schema: resetPasswordSchema.pick({ password: true }), optional: [] },
  profile: { schema: profileSchema, optional: ['shopName'] },
  'email-change': { schema: emailChangeSchema, optional: ['currentPassword'] },
  'password-change': { schema: passwordChangeSchema, optional: ['currentPassword'] },
  'delete-account': { schema: deleteAccountSchema, optional: ['password'] },
} as const satisfies Record<string, FormCheck>;

export type AccountFormName = keyof typeof accountFormChecks;

export function isAccountFormName(name: string | undefined): name is AccountFormName {
  return name !== undefined && Object.hasOwn(accountFormChecks, name);
}

/** The fields as the schema sees them: blank optional fields left out. */
export function formInput(name: AccountFormName, fields: Record<string, string>): Record<string, string> {
  const copy = { ...fields };
  for (const key of accountFormChecks[name].optional) if (copy[key]?.trim() === '') delete copy[key];
  return copy;
}

/** Field messages for a filled-in form; empty when it may be sent. */
export function checkAccountForm(name: AccountFormName, fields: Record<string, string>): Record<string, string[]> {
  const parsed = accountFormChecks[name].schema.safeParse(formInput(name, fields));
  return parsed.success ? {} : fieldErrors(parsed.error);
}
