// Signed unsubscribe links: a round trip works; anything altered, cut or signed with another secret does not.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { signUnsubscribe, verifyUnsubscribe, type StopWhat } from '@/lib/notifications/unsubscribe-token';

const secret = 'unit-test-secret-0123456789abcdef';

describe('unsubscribe tokens', () => {
  it('round-trips every kind of stop', () => {
    const whats: StopWhat[] = [{ follow: 42 }, { kind: 'fix_proofed' }, { digest: true }];
    for (const what of whats) expect(verifyUnsubscribe(secret, signUnsubscribe(secret, { userId: 7, what }))).toEqual({ userId: 7, what });
  });

  it('refuses another secret, another member and a changed target', () => {
    const token = signUnsubscribe(secret, { userId: 7, what: { follow: 42 } });
    expect(verifyUnsubscribe('another-secret-0123456789abcdef', token)).toBeNull();
    expect(verifyUnsubscribe(secret, token.replace(/^7\./, '8.'))).toBeNull();
    expect(verifyUnsubscribe(secret, token.replace('.f42.', '.f43.'))).toBeNull();
    expect(verifyUnsubscribe(secret, token.slice(0, -1))).toBeNull();
    expect(verifyUnsubscribe(secret, '')).toBeNull();
    expect(verifyUnsubscribe(secret, '../../etc/passwd')).toBeNull();
  });

  it('never accepts a token with any single character changed', () => {
    const token = signUnsubscribe(secret, { userId: 1234, what: { kind: 'bench_report' } });
    fc.assert(
      fc.property(
        fc.nat({ max: token.length - 1 }),
        fc.constantFrom(...'0123456789abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ-_.'),
        (at, ch) => {
          fc.pre(token[at] !== ch);
          const changed = token.slice(0, at) + ch + token.slice(at + 1);
          expect(verifyUnsubscribe(secret, changed)).toBeNull();
        },
      ),
      { numRuns: 500 },
    );
  });
});
