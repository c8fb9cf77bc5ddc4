// Reference checks of the bench score against Wilson (1927), cross-checked with npm statistics libraries.
import { describe, expect, it } from 'vitest';
import normalQuantile from '@stdlib/stats-base-dists-normal-quantile';
import jStat from 'jstat';
import { wilsonLowerBound, Z_95 } from '@/lib/bench/bench-score';

function bound(k: number, n: number, z?: number): number {
  const result = wilsonLowerBound(k, n, z);
  if (!result.ok || result.value === null) throw new Error('no bound');
  return result.value;
}

describe('Wilson score interval lower bound', () => {
  it.each([
    [8, 10, 0.4902], // E. B. Wilson (1927), JASA 22:209-212, score interval at 95 %
    [80, 100, 0.7112], // Wilson (1927) at 95 %
    [1, 1, 0.2065], // Wilson (1927) at 95 %
  ])('%i of %i gives %f', (k, n, expected) => {
    expect(Number(bound(k, n).toFixed(4))).toBe(expected);
  });

  it('gives 0 for 0 successes and no score for no trials', () => {
    expect(bound(0, 12)).toBe(0); // Wilson (1927): the lower bound at p̂ = 0 is 0
    expect(wilsonLowerBound(0, 0)).toEqual({ ok: true, value: null });
  });

  it('uses z = 1.96, the 97.5 % normal quantile, as stdlib and jstat compute it', () => {
    const fromStdlib = normalQuantile(0.975, 0, 1); // @stdlib/stats-base-dists-normal-quantile
    const fromJstat = jStat.normal.inv(0.975, 0, 1); // jstat
    expect(Math.abs(fromStdlib - fromJstat)).toBeLessThan(1e-9);
    expect(Number(fromStdlib.toFixed(2))).toBe(Z_95);
  });

  it('agrees with bounds at the exact quantile to within 1e-4', () => {
    const exactZ = normalQuantile(0.975, 0, 1);
    for (const [k, n] of [
      [8, 10],
      [80, 100],
      [1, 1],
      [3.5, 7],
      [45, 60],
    ] as const) {
      expect(Math.abs(bound(k, n) - bound(k, n, exactZ))).toBeLessThan(1e-4);
    }
  });

  it('satisfies the defining equation: at the bound, the observed proportion is z standard errors above it', () => {
    // Wilson (1927): the bound p solves (p̂ − p) / √(p(1 − p)/n) = z; jstat's normal CDF of that is 0.975
    const exactZ = jStat.normal.inv(0.975, 0, 1);
    for (const [k, n] of [
      [8, 10],
      [80, 100],
      [1, 1],
      [7.5, 12],
      [2, 9],
    ] as const) {
      const p = bound(k, n, exactZ);
      const standardised = (k / n - p) / Math.sqrt((p * (1 - p)) / n);
      expect(jStat.normal.cdf(standardised, 0, 1)).toBeCloseTo(0.975, 9);
    }
  });
});
