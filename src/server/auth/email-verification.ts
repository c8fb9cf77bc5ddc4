// Confirming an e-mail address with our own single-use token, and sending a fresh confirmation mail.
import { consume } from '../http/rate-limit';
import { enqueueMail } from '../mail/outbox';
import { confirmAddressMail } from '../mail/templates';
import type { SessionUser } from '@/lib/permissions';
import { tokenSchema } from '@/lib/schemas/account-fields';
import { redirectTo, tooMany, type FormOutcome } from './form-outcome';
import { siteUrl } from './sign-up';
import { consumeToken, issueToken } from './user-tokens';
import { markVerified } from './users';

export type VerifyResult = { ok: true } | { ok: false; problem: 'malformed' | 'unknown' | 'used' | 'expired' };

export async function verifyAddress(rawToken: string | null): Promise<VerifyResult> {
  const parsed = tokenSchema.safeParse(rawToken);
  if (!parsed.success) return { ok: false, problem: 'malformed' };
  const check = await consumeToken(parsed.data, 'verify_email');
  if (!check.ok) return check;
  await markVerified(check.userId);
  return { ok: true };
}

export async function resendConfirmation(user: SessionUser, clientKey: string): Promise<FormOutcome> {
  if (user.verified) return redirectTo('/account?notice=already-confirmed');
  const limit = await consume('email_request', { ip: clientKey, account: user.email });
  if (!limit.ok) return tooMany(limit);
  const token = await issueToken(user.id, 'verify_email');
  await enqueueMail(confirmAddressMail(user.email, user.name, siteUrl(`/verify?token=${token}`)));
  return redirectTo('/account?notice=confirmation-sent');
}
