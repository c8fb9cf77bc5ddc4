// Every rate limit lives in one table: named, with its window, its scopes and its sentence to a person.
import { describe, expect, it } from 'vitest';
import { limitRefusal, limits, limitSpecs } from '@/server/http/rate-limit';

describe('the limits table', () => {
  it('names every limit of the site', () => {
    expect(Object.keys(limits).sort()).toEqual([
      'api_token',
      'bench_report',
      'email_request',
      'note_create',
      'note_miss',
      'reset_password',
      'sign_in_failure',
      'sign_up',
    ]);
  });

  it('counts each limit per address, per account or both, with a positive window', () => {
    for (const limit of Object.values(limits)) {
      const scopes = ['perIp' in limit ? limit.perIp : undefined, 'perAccount' in limit ? limit.perAccount : undefined].filter(
        (spec) => spec !== undefined,
      );
      expect(scopes.length).toBeGreaterThan(0);
      for (const spec of scopes) {
        expect(Number.isInteger(spec.points) && spec.points > 0).toBe(true);
        expect(spec.windowSeconds).toBeGreaterThanOrEqual(60);
      }
    }
  });

  it('counts bench work per member and note misses per address', () => {
    expect(limits.bench_report).toEqual(expect.objectContaining({ perAccount: { points: 30, windowSeconds: 3600 } }));
    expect(limits.note_create).toEqual(expect.objectContaining({ perAccount: { points: 60, windowSeconds: 3600 } }));
    expect(limits.note_miss).toEqual(expect.objectContaining({ perIp: { points: 20, windowSeconds: 900 } }));
  });

  it('lists the address-and-account limits apart, for the sign-in family', () => {
    expect(Object.keys(limitSpecs).sort()).toEqual(['email_request', 'reset_password', 'sign_in_failure', 'sign_up']);
  });
});

describe('limitRefusal', () => {
  it('is a 429 refusal with the wait in whole minutes and the Retry-After seconds', () => {
    const refused = limitRefusal('sign_in_failure', 61);
    expect(refused).toMatchObject({ ok: false, code: 'too_many_requests', retryAfterSeconds: 61 });
    expect(refused.message).toBe('Too many attempts from here. Please wait about 2 minutes and try again.');
    expect(limitRefusal('sign_up', 30).message).toContain('about 1 minute and');
  });

  it('gives every limit a sentence of its own with no placeholder left', () => {
    for (const name of Object.keys(limits) as (keyof typeof limits)[]) {
      const message = limitRefusal(name, 600).message;
      expect(message).toMatch(/^[A-Z].*\.$/);
      expect(message).not.toContain('{minutes}');
    }
  });
});
