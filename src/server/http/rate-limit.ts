// Every rate limit, named in one table and kept in PostgreSQL (rate_limits) so every app instance counts together.
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { config } from '../core/config';
import { db } from '../core/db';
import { refuse, succeed, type Outcome } from './result';

interface LimitSpec {
  /** Requests (or, for limits that count failures only, failures) allowed per window. */
  points: number;
  windowSeconds: number;
}

interface Limit {
  /** Counted per client address (see clientKey). */
  perIp?: LimitSpec;
  /** Counted per account: an e-mail address, or a member's id. */
  perAccount?: LimitSpec;
  /** What the person is told when it is used up; `{minutes}` is the wait. */
  message: string;
}

const hour = 60 * 60;
const quarterHour = 15 * 60;

/**
 * Every limit of the site. Sign-in and note lookups count failures only (check first, consume on a miss), so members
 * who type well and customers opening a real note are never held up.
 */
export const limits = {
  sign_in_failure: {
    perIp: { points: 30, windowSeconds: quarterHour },
    perAccount: { points: 8, windowSeconds: quarterHour },
    message: 'Too many attempts from here. Please wait about {minutes} and try again.',
  },
  sign_up: {
    perIp: { points: 8, windowSeconds: hour },
    perAccount: { points: 3, windowSeconds: hour },
    message: 'Too many attempts from here. Please wait about {minutes} and try again.',
  },
  email_request: {
    perIp: { points: 12, windowSeconds: hour },
    perAccount: { points: 4, windowSeconds: hour },
    message: 'Too many attempts from here. Please wait about {minutes} and try again.',
  },
  reset_password: {
    perIp: { points: 12, windowSeconds: hour },
    perAccount: { points: 6, windowSeconds: hour },
    message: 'Too many attempts from here. Please wait about {minutes} and try again.',
  },
  /** Bench reports saved, per member. */
  bench_report: {
    perAccount: { points: 30, windowSeconds: hour },
    message: 'You have saved many bench reports in a short time. Try again in about {minutes}.',
  },
  /** Hand-over notes created, per member. */
  note_create: {
    perAccount: { points: 60, windowSeconds: hour },
    message: 'You have written many hand-over notes in a short time. Try again in about {minutes}.',
  },
  /** Requests made with one personal API token (counted per token: the account key is `token:<id>`). */
  api_token: {
    perAccount: { points: 600, windowSeconds: quarterHour },
    message: 'This API token has made 600 requests in 15 minutes. Wait about {minutes}, then go on; spread a large sync out over time.',
  },
  /** Codes looked up that do not exist, per client address: guessing stops after a short burst. */
  note_miss: {
    perIp: { points: 20, windowSeconds: quarterHour },
    message: 'Too many codes tried from here. Wait a few minutes and check the code on your invoice, e.g. 7KQ2M X9P4H.',
  },
} as const satisfies Record<string, Limit>;

export type LimitName = keyof typeof limits;

/** The limits counted both per client address and per account (sign-in, sign-up, e-mail requests, resets). */
export const limitSpecs = Object.fromEntries(
  Object.entries(limits).flatMap(([name, limit]: [string, Limit]) =>
    limit.perIp && limit.perAccount ? [[name, { perIp: limit.perIp, perAccount: limit.perAccount }]] : [],
  ),
) as Record<string, { perIp: LimitSpec; perAccount: LimitSpec }>;
type Scope = 'perIp' | 'perAccount';

/** Who a request is counted against: its client address, its account, or both. */
export interface LimitKeys {
  ip?: string | null;
  account?: string | null;
}

const limiters = new Map<string, RateLimiterPostgres>();

function limiter(name: LimitName, scope: Scope, spec: LimitSpec): RateLimiterPostgres {
  const key = `${name}:${scope === 'perIp' ? 'ip' : 'account'}`;
  let found = limiters.get(key);
  if (!found) {
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

/** The (limiter, key value, points) pairs a request is counted in: one per scope the limit has and the caller names. */
function stores(name: LimitName, keys: LimitKeys): Array<[RateLimiterPostgres, string, number]> {
  const limit: Limit = limits[name];
  const pairs: Array<[RateLimiterPostgres, string, number]> = [];
  for (const [scope, value] of [
    ['perIp', keys.ip],
    ['perAccount', keys.account],
  ] as const) {
    const spec = limit[scope];
    if (spec && value) pairs.push([limiter(name, scope, spec), value, spec.points]);
  }
  return pairs;
}

function minutesText(seconds: number): string {
  const minutes = Math.max(1, Math.ceil(seconds / 60));
  return `${minutes} minute${minutes === 1 ? '' : 's'}`;
}

/** The refusal for a used-up limit: a 429 with the limit's sentence and the wait. */
export function limitRefusal(name: LimitName, retryAfterSeconds: number) {
  return refuse(
    'too_many_requests',
    limits[name].message.replace('{minutes}', minutesText(retryAfterSeconds)),
    undefined,
    undefined,
    retryAfterSeconds,
  );
}

function blocked(name: LimitName, res: RateLimiterRes) {
  return limitRefusal(name, Math.max(1, Math.ceil(res.msBeforeNext / 1000)));
}

/** Counts one request against every key; refused once any is used up. */
export async function consume(name: LimitName, keys: LimitKeys): Promise<Outcome<null>> {
  let outcome: Outcome<null> = succeed(null);
  for (const [store, value] of stores(name, keys)) {
    try {
      await store.consume(value);
    } catch (error) {
      if (!(error instanceof RateLimiterRes)) throw error;
      outcome = outcome.ok ? blocked(name, error) : outcome;
    }
  }
  return outcome;
}

/** Whether the keys are already used up, without counting this request (for failure-only limits). */
export async function check(name: LimitName, keys: LimitKeys): Promise<Outcome<null>> {
  for (const [store, value, points] of stores(name, keys)) {
    const res = await store.get(value);
    if (res && res.consumedPoints >= points) return blocked(name, res);
  }
  return succeed(null);
}

/** A successful sign-in clears the account's failures (the address's count stays). */
export async function forgive(name: LimitName, account: string): Promise<void> {
  for (const [store, value] of stores(name, { account })) await store.delete(value);
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
