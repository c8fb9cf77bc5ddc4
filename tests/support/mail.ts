// Reading the test mail sink's folder: wait for a message to an address and pull a link out of it.
import { listMail, type StoredMail } from '../../src/server/mail/sink-store';
import { mailDirFor } from './test-env';

export async function mailsTo(serverPort: number, to: string): Promise<StoredMail[]> {
  const all = await listMail(mailDirFor(serverPort), 10_000);
  return all.filter((mail) => mail.to.some((address) => address.toLowerCase() === to.toLowerCase()));
}

/** The newest message to `to` (optionally with a subject containing `subject`), waiting for it to arrive. */
export async function waitForMail(
  serverPort: number,
  to: string,
  options: { subject?: string; count?: number; timeoutMs?: number } = {},
): Promise<StoredMail> {
  const deadline = Date.now() + (options.timeoutMs ?? 10_000);
  for (;;) {
    const found = (await mailsTo(serverPort, to)).filter((mail) => !options.subject || mail.subject.includes(options.subject));
    if (found.length >= (options.count ?? 1) && found[0]) return found[0];
    if (Date.now() > deadline)
      throw new Error(`No mail to ${to}${options.subject ? ` about "${options.subject}"` : ''} within the time allowed`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/** The first link in the plain-text part whose path starts with `pathPrefix`. */
export function linkIn(mail: StoredMail, pathPrefix: string): URL {
  for (const match of mail.text.matchAll(/https?:\/\/[^\s<>"]+/g)) {
    const url = new URL(match[0]);
    if (url.pathname.startsWith(pathPrefix)) return url;
  }
  throw new Error(`No ${pathPrefix} link in "${mail.subject}":\n${mail.text}`);
}

/** Waits a moment and returns how many messages went to `to`: for checking that nothing was sent. */
export async function countAfterPause(serverPort: number, to: string, pauseMs = 600): Promise<number> {
  await new Promise((resolve) => setTimeout(resolve, pauseMs));
  return (await mailsTo(serverPort, to)).length;
}
