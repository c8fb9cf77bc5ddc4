// Rate limits for signing up and in, kept in PostgreSQL (rate_limits) so every app instance shares them.
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { config } from '../core/config';
import { db } from '../core/db';

export type LimitName = 'sign_in_failure' | 'sign_up' | 'email_request' | 'reset_password';

interface LimitSpec {
  /** Requests (or, for sign-in, failed attempts) allowed per window. */
  points: number;
  windowSeconds: number;
}

/** Per client address and per e-mail address. Sign-in counts failures only, so members who type well are never held up. */
export const limitSpecs: Record<LimitName, { perIp: LimitSpec; perAccount: LimitSpec }> = {
  sign_in_failure: { perIp: { points: 30, windowSeconds: 15 * 60 }, perAccount: { points: 8, windowSeconds: 15 * 60 } },
  sign_up: { perIp: { points: 8, windowSeconds: 60 * 60 }, perAccount: { points: 3, windowSeconds: 60 * 60 } },
  email_request: { perIp: { points: 12, windowSeconds: 60 * 60 }, perAccount: { points: 4, windowSeconds: 60 * 60 } },
  reset_password: { perIp: { points: 12, windowSeconds: 60 * 60 }, perAccount: { points: 6, windowSeconds: 60 * 60 } },
};

const limiters = new Map<string, RateLimiterPostgres>();

function limiter(name: LimitName, scope: 'ip' | 'account'): RateLimiterPostgres {
  const key = `${name}:${scope}`;
  let found = limiters.get(key);
  if (!found) {
    const spec = scope === 'ip' ? limitSpecs[name].perIp : limitSpecs[name].perAccount;
    found = new RateLimiterPostgres({
      storeClient: db(),
      storeType: 'knex',
      tableName: 'rate_limits',
      // The migration creates the table (key varchar(255) primary key, points integer, expire bigint).
      tableCreated: true,
      keyPrefix: key,
      points: spec.points,
      duration: spec.windowSeconds,
    });
    limiters.set(key, found);
  }
  return found;
}

export type LimitOutcome = { ok: true } | { ok: false; retryAfterSeconds: number };

function blocked(res: RateLimiterRes): LimitOutcome {
  return { ok: false, retryAfterSeconds: Math.max(1, Math.ceil(res.msBeforeNext / 1000)) };
}

/** Counts one request against both keys; refused once either is used up. */
export async function consume(name: LimitName, ip: string, account: string | null): Promise<LimitOutcome> {
  const keys: Array<['ip' | 'account', string]> = [['ip', ip]];
  if (account) keys.push(['account', account]);
  let outcome: LimitOutcome = { ok: true };
  for (const [scope, value] of keys) {
    try {
      await limiter(name, scope).consume(value);
    } catch (error) {
      if (!(error instanceof RateLimiterRes)) throw error;
      outcome = outcome.ok ? blocked(error) : outcome;
    }
  }
  return outcome;
}

/** Whether the keys are already used up, without counting this request (for failure-only limits). */
export async function check(name: LimitName, ip: string, account: string | null): Promise<LimitOutcome> {
  const pairs: Array<[RateLimiterPostgres, string, number]> = [[limiter(name, 'ip'), ip, limitSpecs[name].perIp.points]];
  if (account) pairs.push([limiter(name, 'account'), account, limitSpecs[name].perAccount.points]);
  for (const [store, value, points] of pairs) {
    const res = await store.get(value);
    if (res && res.consumedPoints >= points) return blocked(res);
  }
  return { ok: true };
}

/** A successful sign-in clears the account's failures (the address's count stays). */
export async function forgive(name: LimitName, account: string): Promise<void> {
  await limiter(name, 'account').delete(account);
}

/**
 * The address to count a request against. @astrojs/node reports the first X-Forwarded-For value as the
 * client address, which any client can write. With no trusted proxy, a request that carries the header
 * is counted in one shared bucket (its socket address is not visible here): spoofing gains nothing.
 * With TRUST_PROXY = n, the n-th address from the right is the one our nearest trusted proxy saw.
 */
export function clientKey(clientAddress: string, forwardedFor: string | null, trustedHops: number = config().TRUST_PROXY): string {
  const chain = (forwardedFor ?? '')
    .split(',')
    .map((part) => part.trim())
    .filter((part) => part !== '');
  if (trustedHops === 0) return chain.length === 0 ? clientAddress : 'forwarded-untrusted';
  if (chain.length === 0) return clientAddress;
  return chain[Math.max(0, chain.length - trustedHops)] ?? clientAddress;
}

/** The rate-limit key for an Astro request context. */
export function requestClientKey(context: { clientAddress: string; request: Request }): string {
  let address = '';
  try {
    address = context.clientAddress;
  } catch {
    address = 'unknown';
  }
  return clientKey(address, context.request.headers.get('x-forwarded-for'));
}
