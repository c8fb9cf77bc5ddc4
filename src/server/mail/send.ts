// Sending our messages: always a plain-text and an HTML part, from MAIL_FROM.
import { config } from '../core/config';
import { logger } from '../core/logger';
import { mailTransport } from './transport';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Extra headers, e.g. List-Unsubscribe on notification mail. */
  headers?: Record<string, string>;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  const info = await mailTransport().sendMail({ from: config().MAIL_FROM, ...mail });
  const refused = [...info.rejected, ...(info.pending ?? [])];
  if (refused.length > 0) throw new Error(`The mail server refused ${refused.length} recipient(s).`);
}

/**
 * Sends without holding up the answer: a form that may or may not send mail (no account, suspended,
 * already registered) then answers in the same time either way. Failures are logged, never shown.
 */
export function sendInBackground(mail: OutgoingMail | null): void {
  if (!mail) return;
  sendMail(mail).catch((error: unknown) => logger().error({ err: error, subject: mail.subject }, 'mail could not be sent'));
}
