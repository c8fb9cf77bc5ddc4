// The e-mailed sign-in link (Auth.js's Nodemailer provider): what to send, and where the link lands.
import { localPathOr } from '@/lib/local-path';
import { config } from '../core/config';
import { enqueueMail } from '../mail/outbox';
import { noAccountMail, signInLinkMail, suspendedMail } from '../mail/templates';
import { findUserByEmail } from './users';

/** A sign-in link works once and for 15 minutes. */
export const SIGN_IN_LINK_SECONDS = 15 * 60;

/**
 * The mail points at our own page, which shows a button: a mail scanner that follows every link then
 * cannot use the one-time link up (or sign itself in) before its owner does.
 */
export function landingUrl(authUrl: string, origin: string = config().PUBLIC_ORIGIN): string {
  const source = new URL(authUrl);
  const landing = new URL('/sign-in/link', origin);
  for (const key of ['token', 'email']) {
    const value = source.searchParams.get(key);
    if (value !== null) landing.searchParams.set(key, value);
  }
  // Auth.js has made the return address absolute; only a path on this site goes into the mail.
  const callback = new URL(source.searchParams.get('callbackUrl') ?? '/', origin);
  const path = callback.origin === new URL(origin).origin ? `${callback.pathname}${callback.search}` : '/';
  landing.searchParams.set('callbackUrl', localPathOr(path, '/'));
  return landing.href;
}

/** Sends a link to an active account, a short note to an address with no account, the suspension's reason to a suspended one. */
export async function sendSignInLink(params: { identifier: string; url: string }): Promise<void> {
  const user = await findUserByEmail(params.identifier);
  if (!user) {
    await enqueueMail(noAccountMail(params.identifier, 'a sign-in link', new URL('/sign-up', config().PUBLIC_ORIGIN).href));
    return;
  }
  if (user.suspended_at) {
    const rules = new URL('/help/house-rules', config().PUBLIC_ORIGIN).href;
    await enqueueMail(suspendedMail(user.email, user.name, user.suspended_reason ?? '(none was recorded)', rules));
    return;
  }
  await enqueueMail(signInLinkMail(user.email, landingUrl(params.url)));
}
