// Handing one message to the mail relay: always a plain-text and an HTML part, from MAIL_FROM. Only the outbox calls it.
import { config } from '../core/config';
import { mailTransport } from './transport';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Extra headers, e.g. List-Unsubscribe on notification mail. */
  headers?: Record<string, string>;
}

/** `messageId` is the outbox job's id, so a message the relay sees twice carries the same Message-ID both times. */
export async function sendMail(mail: OutgoingMail, messageId?: string): Promise<void> {
  const info = await mailTransport().sendMail({
    from: config().MAIL_FROM,
    ...mail,
    ...(messageId ? { messageId: `<${messageId}@outbox.benchlore.invalid>` } : {}),
  });
  const refused = [...info.rejected, ...(info.pending ?? [])];
  if (refused.length > 0) throw new Error(`The mail server refused ${refused.length} recipient(s).`);
}
