// Reading the session cookie: the decrypted claims are kept per Cookie header only until the token's own expiry,
// and a tampered or expired token is never read as a member, kept or not.
import { encode } from '@auth/core/jwt';
import { beforeAll, describe, expect, it, vi } from 'vitest';

const SECRET = 'unit-test-secret-0123456789abcdef';
let readSessionClaims: typeof import('@/server/auth/session-cookie').readSessionClaims;
let name: string;

beforeAll(async () => {
  vi.stubEnv('AUTH_SECRET', SECRET);
  vi.stubEnv('PUBLIC_ORIGIN', 'http://127.0.0.1:4321');
  const mod = await import('@/server/auth/session-cookie');
  readSessionClaims = mod.readSessionClaims;
  name = mod.sessionCookieName();
});

async function cookieFor(claims: Record<string, unknown>, maxAge = 3600): Promise<string> {
  const token = await encode({ token: claims, secret: SECRET, salt: name, maxAge });
  return `theme=dark; ${name}=${token}`;
}

describe('readSessionClaims', () => {
  it('reads the member and their sign-in time, the same from a second read of the same header', async () => {
    const header = await cookieFor({ sub: '42', authAt: 1_764_000_000_123 });
    const first = await readSessionClaims(header);
    expect(first).toEqual({ userId: 42, signedInAtMs: 1_764_000_000_123 });
    expect(await readSessionClaims(header)).toEqual(first);
  });

  it('stops reading a kept token once it has expired', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    try {
      const header = await cookieFor({ sub: '7' }, 60);
      expect(await readSessionClaims(header)).toMatchObject({ userId: 7 });
      // Past the expiry and the 15 s of clock tolerance Auth.js allows when it decrypts.
      vi.setSystemTime(Date.now() + 80_000);
      expect(await readSessionClaims(header)).toBeNull();
    } finally {
      vi.useRealTimers();
    }
  });

  it('never reads a tampered token or one made with another secret', async () => {
    const header = await cookieFor({ sub: '9' });
    expect(await readSessionClaims(header.slice(0, -4) + 'AAAA')).toBeNull();
    const foreign = await encode({ token: { sub: '9' }, secret: 'another-secret-0123456789abcdef', salt: name });
    expect(await readSessionClaims(`${name}=${foreign}`)).toBeNull();
    expect(await readSessionClaims(null)).toBeNull();
  });
});
