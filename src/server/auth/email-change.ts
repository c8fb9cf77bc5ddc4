// Changing an account's e-mail address: a link goes to the new address, and only opening it changes the
// account (the old address is told afterwards). Answers never say whether the new address has an account.
import { db } from '../core/db';
import { writeAudit } from '../core/audit';
import { consume } from '../http/rate-limit';
import { enqueueMail } from '../mail/outbox';
import { addressChangedMail, confirmNewAddressMail } from '../mail/templates';
import type { SessionUser } from '@/lib/permissions';
import { tokenSchema } from '@/lib/schemas/account-fields';
import { redirectTo, tooMany, type FormOutcome } from './form-outcome';
import { siteUrl } from './sign-up';
import { consumeToken, issueToken, peekToken } from './user-tokens';
import { endAllSessions } from './users';

/** Mails the confirmation link to the new address (rate-limited like every mailed link). */
export async function requestEmailChange(user: SessionUser, newEmail: string, clientKey: string): Promise<FormOutcome> {
  if (newEmail === user.email) return redirectTo('/account?notice=email-unchanged');
  const limit = await consume('email_request', { ip: clientKey, account: user.email });
  if (!limit.ok) return tooMany(limit);
  const token = await issueToken(user.id, 'change_email', { newEmail });
  await enqueueMail(confirmNewAddressMail(newEmail, user.name, siteUrl(`/account/email?token=${token}`)));
  return redirectTo('/account?notice=email-link-sent');
}

export type EmailChangeProblem = 'malformed' | 'unknown' | 'used' | 'expired' | 'taken';
export type EmailChangeResult = { ok: true; email: string } | { ok: false; problem: EmailChangeProblem };

/** Whether the link would work, without using it up: the page shows a button (mail scanners only GET). */
export async function checkEmailChangeLink(rawToken: string | null): Promise<EmailChangeResult> {
  const parsed = tokenSchema.safeParse(rawToken);
  if (!parsed.success) return { ok: false, problem: 'malformed' };
  const check = await peekToken(parsed.data, 'change_email');
  return check.ok ? { ok: true, email: check.newEmail ?? '' } : check;
}

/**
 * Uses the link up and moves the account to the new address, confirmed. Every session ends (the member
 * signs in with the new address), the old address is told, and the change goes to the audit log.
 */
export async function confirmEmailChange(rawToken: string | null): Promise<EmailChangeResult> {
  const parsed = tokenSchema.safeParse(rawToken);
  if (!parsed.success) return { ok: false, problem: 'malformed' };
  const outcome = await db().transaction(async (trx) => {
    const check = await consumeToken(parsed.data, 'change_email', trx);
    if (!check.ok) return check;
    const newEmail = check.newEmail ?? '';
    const user = await trx('users').where({ id: check.userId }).whereNull('deleted_at').forUpdate().first('id', 'name', 'email');
    if (!user) return { ok: false as const, problem: 'unknown' as const };
    const taken = await trx('users').where({ email: newEmail }).whereNot({ id: user.id }).first('id');
    if (taken) return { ok: false as const, problem: 'taken' as const };
    await trx('users').where({ id: user.id }).update({ email: newEmail, emailVerified: trx.fn.now() });
    await endAllSessions(user.id, trx);
    // The addresses themselves stay out of the log: it outlives a deleted account.
    await writeAudit(
      { actorId: user.id, action: 'user.email_change', subjectType: 'user', subjectId: user.id, detail: { changed: 'email' } },
      trx,
    );
    return { ok: true as const, email: newEmail, name: user.name as string, oldEmail: user.email as string };
  });
  if (!outcome.ok) return outcome;
  await enqueueMail(addressChangedMail(outcome.oldEmail, outcome.name, outcome.email, siteUrl('/reset')));
  return { ok: true, email: outcome.email };
}
