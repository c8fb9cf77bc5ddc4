// Joining: a new member with a hashed password, signed in at once, and a confirmation mail; an address already in use gets a note instead.
import { signUpSchema } from '@/lib/schemas/sign-up';
import { config } from '../core/config';
import { fieldErrors } from '../http/responses';
import { consume } from '../http/rate-limit';
import { enqueueMail } from '../mail/outbox';
import { alreadyJoinedMail, confirmAddressMail } from '../mail/templates';
import { formInput } from '@/lib/schemas/account-forms';
import { signInWithPassword } from './auth-js';
import { invalid, redirectTo, tooMany, type FormOutcome } from './form-outcome';
import { passwordWeaknesses } from './password-strength';
import { hashPassword } from './passwords';
import { issueToken } from './user-tokens';
import { createMember, findUserByEmail } from './users';

export function siteUrl(path: string): string {
  return new URL(path, config().PUBLIC_ORIGIN).href;
}

/** Where joining lands: the same address whether or not the e-mail address was new. */
export const JOINED_PATH = '/sign-up/check-email';

export async function signUp(fields: Record<string, string>, asker: { clientKey: string; origin: string }): Promise<FormOutcome> {
  const parsed = signUpSchema.safeParse(formInput('sign-up', fields));
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const { name, email, password, shopName } = parsed.data;
  const limit = await consume('sign_up', { ip: asker.clientKey, account: email });
  if (!limit.ok) return tooMany(limit);
  const weaknesses = passwordWeaknesses(password, [name, email, shopName ?? '']);
  if (weaknesses.length > 0) return invalid({ password: weaknesses });

  // Hashed in every case, so a known address answers no faster than a new one.
  const passwordHash = await hashPassword(password);
  const existing = await findUserByEmail(email);
  const newId = existing ? null : await createMember({ name, email, passwordHash, shopName });
  if (newId === null) {
    await enqueueMail(alreadyJoinedMail(email, siteUrl('/sign-in'), siteUrl('/reset')));
    // The same page; the owner of the address hears of the attempt by mail, and nobody is signed in to their account.
    return redirectTo(JOINED_PATH);
  }
  const token = await issueToken(newId, 'verify_email');
  await enqueueMail(confirmAddressMail(email, name, siteUrl(`/verify?token=${token}`)));
  // Joining signs the new member in, through the same Auth.js step as the sign-in form.
  const signedIn = await signInWithPassword(asker.origin, email, password, JOINED_PATH);
  return signedIn.ok ? redirectTo(JOINED_PATH, signedIn.setCookies) : redirectTo(JOINED_PATH);
}
