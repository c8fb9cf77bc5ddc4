// The sign-in page's two forms: password (Credentials) and "e-mail me a link" (Nodemailer), rate-limited.
import { emailRequestSchema } from '@/lib/schemas/email-request';
import { signInSchema } from '@/lib/schemas/sign-in';
import { fieldErrors } from '../http/responses';
import { check, consume, forgive } from '../http/rate-limit';
import { signInWithPassword, requestSignInLink } from './auth-js';
import { invalid, redirectTo, refused, tooMany, type FormOutcome } from './form-outcome';
import { findUserByEmail } from './users';

interface Asker {
  origin: string;
  clientKey: string;
}

/** What a suspended member reads when they sign in: the moderator's reason, in their words. */
export function suspendedMessage(reason: string | null): string {
  const why = reason ? ` The reason the moderator gave: “${reason}”` : '';
  return `This account is suspended and cannot sign in.${why} If you think this is a mistake, the house rules say how to ask the moderators to look again.`;
}

export async function passwordSignIn(fields: Record<string, string>, asker: Asker): Promise<FormOutcome> {
  const parsed = signInSchema.safeParse(fields);
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const { email, password, next = '/' } = parsed.data;
  // Failures only are counted; once either count is used up, even the right password waits.
  const limit = await check('sign_in_failure', { ip: asker.clientKey, account: email });
  if (!limit.ok) return tooMany(limit);
  const outcome = await signInWithPassword(asker.origin, email, password, next);
  if (outcome.ok) {
    await forgive('sign_in_failure', email);
    return redirectTo(outcome.location, outcome.setCookies);
  }
  if (outcome.code === 'suspended') {
    // Only the right password gets this far, so the owner is told the moderator's reason.
    const reason = (await findUserByEmail(email))?.suspended_reason;
    return refused(403, suspendedMessage(reason ?? null));
  }
  await consume('sign_in_failure', { ip: asker.clientKey, account: email });
  // One message for an unknown address and a wrong password alike.
  return refused(401, 'That e-mail address and password do not match an account. Check both, or use a sign-in link instead.');
}

export async function linkRequest(fields: Record<string, string>, asker: Asker): Promise<FormOutcome> {
  const parsed = emailRequestSchema.safeParse(fields);
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const { email, next = '/' } = parsed.data;
  const limit = await consume('email_request', { ip: asker.clientKey, account: email });
  if (!limit.ok) return tooMany(limit);
  const outcome = await requestSignInLink(asker.origin, email, next);
  if (!outcome.ok) return refused(500, 'The sign-in link could not be prepared. Please try again in a moment.');
  return redirectTo('/sign-in/link-sent');
}
