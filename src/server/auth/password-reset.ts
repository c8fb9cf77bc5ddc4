// Forgotten passwords: a one-hour, single-use link by e-mail, then a new password that ends every session.
import { emailRequestSchema } from '@/lib/schemas/email-request';
import { resetPasswordSchema } from '@/lib/schemas/reset-password';
import { db } from '../core/db';
import { fieldErrors } from '../http/responses';
import { consume } from '../http/rate-limit';
import { enqueueMail } from '../mail/outbox';
import { noAccountMail, resetPasswordMail } from '../mail/templates';
import { invalid, redirectTo, refused, tooMany, type FormOutcome } from './form-outcome';
import { passwordWeaknesses } from './password-strength';
import { hashPassword } from './passwords';
import { siteUrl } from './sign-up';
import { consumeToken, issueToken, peekToken, type TokenCheck } from './user-tokens';
import { endAllSessions, findUserByEmail, findUserById, markVerified, setPassword } from './users';

export async function requestReset(fields: Record<string, string>, clientKey: string): Promise<FormOutcome> {
  const parsed = emailRequestSchema.safeParse(fields);
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const { email } = parsed.data;
  const limit = await consume('email_request', { ip: clientKey, account: email });
  if (!limit.ok) return tooMany(limit);
  const user = await findUserByEmail(email);
  if (!user) {
    await enqueueMail(noAccountMail(email, 'a password reset', siteUrl('/sign-up')));
  } else if (!user.suspended_at) {
    const token = await issueToken(user.id, 'reset_password');
    await enqueueMail(resetPasswordMail(user.email, siteUrl(`/reset/password?token=${token}`)));
  }
  // The same answer for every address.
  return redirectTo(`/reset?sent=${encodeURIComponent(email)}`);
}

export async function checkResetLink(rawToken: string | null): Promise<TokenCheck | { ok: false; problem: 'malformed' }> {
  if (!rawToken || !/^[A-Za-z0-9_-]{43}$/.test(rawToken)) return { ok: false, problem: 'malformed' };
  return peekToken(rawToken, 'reset_password');
}

export async function resetPassword(fields: Record<string, string>, clientKey: string): Promise<FormOutcome> {
  const parsed = resetPasswordSchema.safeParse(fields);
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const limit = await consume('reset_password', { ip: clientKey });
  if (!limit.ok) return tooMany(limit);
  const peeked = await peekToken(parsed.data.token, 'reset_password');
  if (!peeked.ok) return refused(410, 'This link has expired or has already been used.');
  const user = await findUserById(peeked.userId);
  const weaknesses = passwordWeaknesses(parsed.data.password, [user?.name ?? '', user?.email ?? '']);
  if (weaknesses.length > 0) return invalid({ password: weaknesses });
  const passwordHash = await hashPassword(parsed.data.password);
  const used = await db().transaction(async (trx) => {
    const check = await consumeToken(parsed.data.token, 'reset_password', trx);
    if (!check.ok) return false;
    await setPassword(check.userId, passwordHash, trx);
    // The link reached this inbox: the address is confirmed as well.
    await markVerified(check.userId, trx);
    await endAllSessions(check.userId, trx);
    return true;
  });
  if (!used) return refused(410, 'This link has expired or has already been used.');
  return redirectTo('/sign-in?notice=password-reset');
}
