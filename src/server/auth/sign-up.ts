// Joining: a new member with a hashed password and a confirmation mail; an address already in use gets a note instead.
import { signUpSchema } from '@/lib/schemas/account';
import { config } from '../config';
import { fieldErrors } from '../http';
import { consume } from '../rate-limit';
import { sendInBackground } from '../mail/send';
import { alreadyJoinedMail, confirmAddressMail } from '../mail/templates';
import { formInput } from '@/lib/schemas/account-forms';
import { invalid, redirectTo, tooMany, type FormOutcome } from './form-outcome';
import { passwordWeaknesses } from './password-strength';
import { hashPassword } from './passwords';
import { issueToken } from './user-tokens';
import { createMember, findUserByEmail } from './users';

export function siteUrl(path: string): string {
  return new URL(path, config().PUBLIC_ORIGIN).href;
}

export async function signUp(fields: Record<string, string>, clientKey: string): Promise<FormOutcome> {
  const parsed = signUpSchema.safeParse(formInput('sign-up', fields));
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const { name, email, password, shopName } = parsed.data;
  const limit = await consume('sign_up', clientKey, email);
  if (!limit.ok) return tooMany(limit.retryAfterSeconds);
  const weaknesses = passwordWeaknesses(password, [name, email, shopName ?? '']);
  if (weaknesses.length > 0) return invalid({ password: weaknesses });

  // Hashed in every case, so a known address answers no faster than a new one.
  const passwordHash = await hashPassword(password);
  const existing = await findUserByEmail(email);
  const newId = existing ? null : await createMember({ name, email, passwordHash, shopName });
  if (newId === null) {
    sendInBackground(alreadyJoinedMail(email, siteUrl('/sign-in'), siteUrl('/reset')));
  } else {
    const token = await issueToken(newId, 'verify_email');
    sendInBackground(confirmAddressMail(email, name, siteUrl(`/verify?token=${token}`)));
  }
  // The same page either way: whether an address has an account is never shown.
  return redirectTo(`/sign-up/check-email?email=${encodeURIComponent(email)}`);
}
