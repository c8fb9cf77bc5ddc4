// Unit tests of the bench score: Wilson lower bound edge cases and the weighting of bench reports.
import { describe, expect, it } from 'vitest';
import { benchScore, wilsonLowerBound, Z_95 } from '@/lib/bench/bench-score';

function bound(k: number, n: number, z?: number): number | null {
  const result = wilsonLowerBound(k, n, z);
  if (!result.ok) throw new Error(result.error.message);
  return result.value;
}

describe('wilsonLowerBound', () => {
  it('gives no score without reports and zero without successes', () => {
    expect(bound(0, 0)).toBeNull();
    expect(bound(0, 1)).toBe(0);
    expect(bound(0, 250)).toBe(0);
  });

  it('rises with more evidence at the same proportion', () => {
    const small = bound(4, 5) ?? 0;
    const large = bound(400, 500) ?? 0;
    expect(large).toBeGreaterThan(small);
    expect(large).toBeLessThan(0.8);
  });

  it('takes fractional successes from "partly" outcomes', () => {
    const withHalf = bound(7.5, 10) ?? 0;
    expect(withHalf).toBeGreaterThan(bound(7, 10) ?? 0);
    expect(withHalf).toBeLessThan(bound(8, 10) ?? 0);
  });

  it('stays inside 0 to 1 and below the observed proportion', () => {
    for (const [k, n] of [
      [1, 1],
      [10, 10],
      [3, 7],
      [0.5, 1],
    ] as const) {
      const b = bound(k, n) ?? -1;
      expect(b).toBeGreaterThanOrEqual(0);
      expect(b).toBeLessThan(k / n);
    }
  });

  it('widens with a larger z', () => {
    expect(bound(8, 10, 2.576) ?? 1).toBeLessThan(bound(8, 10, Z_95) ?? 0);
  });

  it('refuses impossible counts', () => {
    expect(wilsonLowerBound(11, 10).ok).toBe(false);
    expect(wilsonLowerBound(-1, 10).ok).toBe(false);
    expect(wilsonLowerBound(1, Number.NaN).ok).toBe(false);
    expect(wilsonLowerBound(1, 2, 0).ok).toBe(false);
  });
});

describe('benchScore', () => {
  it('counts fixed as 1, partly as 0.5 and a fault that came back as not fixed', () => {
    const result = benchScore({ current: { fixed: 6, partly: 2, notFixed: 1, cameBack: 1 } });
    expect(result).toEqual({ ok: true, value: { score: bound(7, 10), n: 10, k: 7, reports: 10 } });
  });

  it('weighs reports on older revisions 0.5 by default', () => {
    const result = benchScore({ current: { fixed: 4 }, older: { fixed: 2, notFixed: 2 } });
    expect(result).toEqual({ ok: true, value: { score: bound(5, 6), n: 6, k: 5, reports: 8 } });
  });

  it('takes another weight for older revisions', () => {
    const result = benchScore({ current: { fixed: 4 }, older: { notFixed: 4 }, olderWeight: 0.25 });
    expect(result.ok && result.value).toMatchObject({ n: 5, k: 4 });
  });

  it('gives a null score with its zero counts when there are no reports', () => {
    expect(benchScore({})).toEqual({ ok: true, value: { score: null, n: 0, k: 0, reports: 0 } });
  });

  it('refuses fractional, negative or out-of-range input', () => {
    expect(benchScore({ current: { fixed: 1.5 } }).ok).toBe(false);
    expect(benchScore({ current: { notFixed: -1 } }).ok).toBe(false);
    expect(benchScore({ olderWeight: 2 }).ok).toBe(false);
  });
});
