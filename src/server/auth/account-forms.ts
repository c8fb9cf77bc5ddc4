// The account page's forms: profile, e-mail address, password, confirmation mail, signing out everywhere,
// deleting the account.
import { deleteAccountSchema } from '@/lib/schemas/delete-account';
import { emailChangeSchema } from '@/lib/schemas/email-change';
import { passwordChangeSchema } from '@/lib/schemas/password-change';
import { profileSchema } from '@/lib/schemas/profile';
import type { SessionUser } from '@/lib/permissions';
import { fieldErrors } from '../http/responses';
import { check, consume } from '../http/rate-limit';
import { resendConfirmation } from './email-verification';
import { requestEmailChange } from './email-change';
import { formInput } from '@/lib/schemas/account-forms';
import { invalid, redirectTo, refused, tooMany, type FormOutcome } from './form-outcome';
import { anonymiseAccount } from './delete-account';
import { passwordWeaknesses } from './password-strength';
import { hashPassword, verifyPassword } from './passwords';
import { endAllSessions, findUserById, setPassword, updateProfile } from './users';

export const accountIntents = ['profile', 'email', 'password', 'resend-confirmation', 'sign-out-everywhere', 'delete'] as const;
export type AccountIntent = (typeof accountIntents)[number];

/** A form that asks for the current password counts a wrong one like a failed sign-in. */
async function currentPasswordMatches(
  userId: number,
  email: string,
  password: string | undefined,
  clientKey: string,
): Promise<FormOutcome | null> {
  const row = await findUserById(userId);
  if (!row?.password_hash) return null;
  const limit = await check('sign_in_failure', { ip: clientKey, account: email });
  if (!limit.ok) return tooMany(limit);
  if (password && (await verifyPassword(row.password_hash, password))) return null;
  await consume('sign_in_failure', { ip: clientKey, account: email });
  return invalid({ currentPassword: ['That is not your current password.'] });
}

async function changeProfile(user: SessionUser, fields: Record<string, string>): Promise<FormOutcome> {
  const parsed = profileSchema.safeParse(formInput('profile', fields));
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  await updateProfile(user.id, parsed.data);
  return redirectTo('/account?notice=profile-saved');
}

async function changePassword(user: SessionUser, fields: Record<string, string>, clientKey: string): Promise<FormOutcome> {
  const parsed = passwordChangeSchema.safeParse(formInput('password-change', fields));
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const wrong = await currentPasswordMatches(user.id, user.email, parsed.data.currentPassword, clientKey);
  if (wrong) return wrong;
  const weaknesses = passwordWeaknesses(parsed.data.newPassword, [user.name, user.email, user.shopName ?? '']);
  if (weaknesses.length > 0) return invalid({ newPassword: weaknesses });
  // Every session ends, this one included: sign in again with the new password.
  await setPassword(user.id, await hashPassword(parsed.data.newPassword));
  return redirectTo('/sign-in?notice=password-changed');
}

async function changeEmail(user: SessionUser, fields: Record<string, string>, clientKey: string): Promise<FormOutcome> {
  const parsed = emailChangeSchema.safeParse(formInput('email-change', fields));
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const wrong = await currentPasswordMatches(user.id, user.email, parsed.data.currentPassword, clientKey);
  if (wrong) return wrong;
  return requestEmailChange(user, parsed.data.newEmail, clientKey);
}

async function deleteAccount(user: SessionUser, fields: Record<string, string>, clientKey: string): Promise<FormOutcome> {
  const parsed = deleteAccountSchema.safeParse(formInput('delete-account', fields));
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const wrong = await currentPasswordMatches(user.id, user.email, parsed.data.password, clientKey);
  if (wrong) return !wrong.ok && wrong.fields?.currentPassword ? invalid({ password: wrong.fields.currentPassword }) : wrong;
  const deleted = await anonymiseAccount(user.id, user.id);
  if (!deleted) return refused(409, 'This account has already been deleted.');
  return redirectTo('/account/deleted');
}

export async function handleAccountForm(user: SessionUser, fields: Record<string, string>, clientKey: string): Promise<FormOutcome> {
  switch (fields.intent) {
    case 'profile':
      return changeProfile(user, fields);
    case 'email':
      return changeEmail(user, fields, clientKey);
    case 'password':
      return changePassword(user, fields, clientKey);
    case 'resend-confirmation':
      return resendConfirmation(user, clientKey);
    case 'sign-out-everywhere':
      await endAllSessions(user.id);
      return redirectTo('/sign-in?notice=signed-out-everywhere');
    case 'delete':
      return deleteAccount(user, fields, clientKey);
    default:
      return invalid({ intent: ['Choose one of the forms on this page.'] }, 'This form was not recognised.');
  }
}
