// Bench score: the Wilson score interval's lower bound (E. B. Wilson 1927) over weighted bench reports.
import { z } from 'zod';
import { fail, ok, type Result } from '@/lib/values/result';
import { readInput } from './input';
import { figures } from './numbers';

/** The standard normal quantile for a two-sided 95 % interval, rounded as usual: Φ⁻¹(0.975) ≈ 1.95996. */
export const Z_95 = 1.96;

/**
 * Lower bound of the Wilson score interval for k successes in n trials:
 * (p + z²/2n − z·√(p(1−p)/n + z²/4n²)) / (1 + z²/n), p = k/n. k may be fractional (a "partly" counts
 * half). No reports, no score: n = 0 gives null.
 */
export function wilsonLowerBound(k: number, n: number, z: number = Z_95): Result<number | null> {
  if (![k, n, z].every((x) => typeof x === 'number' && Number.isFinite(x))) {
    return fail('k, n and z must be numbers.', 'k = 8, n = 10');
  }
  if (n < 0 || k < 0) return fail('Counts cannot be negative.', 'k = 8, n = 10');
  if (k > n) return fail(`k (${k}) cannot exceed n (${n}).`, 'k = 8, n = 10');
  if (z <= 0) return fail('z must be above zero.', 'z = 1.96 for 95 %');
  if (n === 0) return ok(null);
  if (k === 0) return ok(0);
  const p = k / n;
  const z2 = z * z;
  const centre = p + z2 / (2 * n);
  const spread = z * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  return ok(Math.max(0, (centre - spread) / (1 + z2 / n)));
}

const count = (what: string) =>
  z
    .number({ error: `${what} must be a number.` })
    .int(`${what} must be a whole number.`)
    .nonnegative(`${what} cannot be negative.`)
    .default(0);

export const outcomeCountsSchema = figures(
  {
    fixed: count('Fixed'),
    partly: count('Partly'),
    notFixed: count('Not fixed'),
    /** Reported fixed, then the fault came back: counts as not fixed. */
    cameBack: count('Came back'),
  },
  'fixed 8, partly 1, not fixed 1',
);
export type OutcomeCounts = z.input<typeof outcomeCountsSchema>;

export const benchScoreInputSchema = figures(
  {
    /** Reports on the fix's current revision. */
    current: outcomeCountsSchema.default({ fixed: 0, partly: 0, notFixed: 0, cameBack: 0 }),
    /** Reports on older revisions: the fix may have changed since. */
    older: outcomeCountsSchema.default({ fixed: 0, partly: 0, notFixed: 0, cameBack: 0 }),
    olderWeight: z
      .number({ error: 'The weight of older reports is a number from 0 to 1, e.g. 0.5.' })
      .min(0, 'The weight of older reports is 0 to 1, e.g. 0.5.')
      .max(1, 'The weight of older reports is 0 to 1, e.g. 0.5.')
      .default(0.5),
  },
  'current reports: fixed 8, partly 1, not fixed 1',
);
export type BenchScoreInput = z.input<typeof benchScoreInputSchema>;

export interface BenchScore {
  /** Wilson lower bound at 95 %; null when there are no reports. Never shown without n. */
  score: number | null;
  /** Weighted number of reports. */
  n: number;
  /** Weighted successes: fixed counts 1, partly 0.5. */
  k: number;
  /** Reports as counted, before weights. */
  reports: number;
}

export function benchScore(input: BenchScoreInput): Result<BenchScore> {
  const read = readInput(benchScoreInputSchema, input, '8 fixed, 1 partly, 1 not fixed on the current revision');
  if (!read.ok) return read;
  const { current, older, olderWeight } = read.value;
  const totalOf = (c: typeof current): number => c.fixed + c.partly + c.notFixed + c.cameBack;
  const successesOf = (c: typeof current): number => c.fixed + 0.5 * c.partly;
  const n = totalOf(current) + olderWeight * totalOf(older);
  const k = successesOf(current) + olderWeight * successesOf(older);
  const score = wilsonLowerBound(k, n);
  if (!score.ok) return score;
  return ok({ score: score.value, n, k, reports: totalOf(current) + totalOf(older) });
}
