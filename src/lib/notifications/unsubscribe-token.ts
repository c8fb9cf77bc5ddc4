// Signed unsubscribe links: they need no sign-in, so the link itself must prove which member and what to stop.
// HMAC-SHA-256 (RFC 2104) over the payload, base64url (RFC 4648 §5) without padding; no expiry, because an
// old mail's unsubscribe link must still work (RFC 8058 asks that it keep working for as long as mail is sent).
import { createHmac, timingSafeEqual } from 'node:crypto';

export type StopWhat = { follow: number } | { kind: string } | { digest: true };

export interface UnsubscribeClaim {
  userId: number;
  what: StopWhat;
}

function encodeWhat(what: StopWhat): string {
  if ('follow' in what) return `f${what.follow}`;
  if ('kind' in what) return `k${what.kind}`;
  return 'd';
}

function decodeWhat(text: string): StopWhat | null {
  if (text === 'd') return { digest: true };
  if (/^f[1-9]\d{0,9}$/.test(text)) return { follow: Number(text.slice(1)) };
  if (/^k[a-z_]{1,40}$/.test(text)) return { kind: text.slice(1) };
  return null;
}

function mac(secret: string, payload: string): string {
  return createHmac('sha256', `unsubscribe:${secret}`).update(payload).digest('base64url').slice(0, 32);
}

export function signUnsubscribe(secret: string, claim: UnsubscribeClaim): string {
  const payload = `${claim.userId}.${encodeWhat(claim.what)}`;
  return `${payload}.${mac(secret, payload)}`;
}

/** The claim, or null when the token was altered, cut short or signed with another secret. */
export function verifyUnsubscribe(secret: string, token: string): UnsubscribeClaim | null {
  const match = /^([1-9]\d{0,9})\.([a-z0-9_]{1,41})\.([A-Za-z0-9_-]{32})$/.exec(token);
  if (!match) return null;
  const [, user, what, signature] = match;
  const expected = Buffer.from(mac(secret, `${user}.${what}`));
  const given = Buffer.from(signature!);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
  const decoded = decodeWhat(what!);
  return decoded ? { userId: Number(user), what: decoded } : null;
}
