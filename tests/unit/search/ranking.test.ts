// Result order: text relevance, then closeness to the named machine, then bench score, then fix id.
import { describe, expect, it } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import {
  BODY_SHARE,
  CODE_WEIGHT,
  FEW_REPORTS,
  NEUTRAL_BENCH_SCORE,
  benchKey,
  clauseLevel,
  compareRanked,
  proximityOf,
  rank,
  relevanceFromScore,
  relevanceOf,
  type Rankable,
} from '@/lib/search/ranking';

const item = (fixId: number, over: Partial<Rankable> = {}): Rankable => ({
  fixId,
  relevance: { matched: 2, quality: 6 },
  proximity: 0,
  benchScore: null,
  ...over,
});

describe('relevanceOf', () => {
  it('counts required clauses found, weighted, a body-only match by half, and sums their levels with the bonuses', () => {
    expect(relevanceOf([clauseLevel.summary, clauseLevel.none, clauseLevel.body], [1], [1, 1, CODE_WEIGHT])).toEqual({
      matched: 1 + BODY_SHARE * CODE_WEIGHT,
      quality: clauseLevel.summary + clauseLevel.body + 1,
    });
  });
});

describe('relevanceFromScore', () => {
  it('cuts an engine score into twenty steps and clamps odd values', () => {
    expect(relevanceFromScore(0.97)).toEqual({ matched: 0, quality: 19 });
    expect(relevanceFromScore(1.4).quality).toBe(20);
    expect(relevanceFromScore(Number.NaN).quality).toBe(0);
  });
});

describe('proximityOf', () => {
  const target = { machineId: 10, chassisId: 3, makerId: 7 };
  it('ranks same machine over same chassis family over same maker over others', () => {
    expect(proximityOf({ machineIds: [10], chassisIds: [3], makerIds: [7] }, target)).toBe(3);
    expect(proximityOf({ machineIds: [11], chassisIds: [3], makerIds: [7] }, target)).toBe(2);
    expect(proximityOf({ machineIds: [11], chassisIds: [4], makerIds: [7] }, target)).toBe(1);
    expect(proximityOf({ machineIds: [11], chassisIds: [4], makerIds: [8] }, target)).toBe(0);
  });
  it('gives nothing when no machine is named, and no family credit to a machine without one', () => {
    expect(proximityOf({ machineIds: [10], chassisIds: [], makerIds: [7] }, null)).toBe(0);
    expect(proximityOf({ machineIds: [12], chassisIds: [], makerIds: [8] }, { machineId: 10, chassisId: null, makerId: 7 })).toBe(0);
  });
});

describe('compareRanked', () => {
  it('puts concepts matched first, counting the named machine as one more concept, then wording, closeness, bench score', () => {
    const moreRelevant = item(5, { relevance: { matched: 3, quality: 6 } });
    const closer = item(4, { proximity: 3, benchScore: 0.1, benchReports: 10 });
    const betterScored = item(3, { benchScore: 0.9, benchReports: 10 });
    const fartherStranger = item(6, { relevance: { matched: 4, quality: 12 } });
    expect(rank([betterScored, closer, moreRelevant, fartherStranger]).map((r) => r.fixId)).toEqual([6, 4, 5, 3]);
  });
  it("lets the machine's own fix win over a stranger with better wording but no more concepts", () => {
    const stranger = item(1, { relevance: { matched: 2, quality: 12 } });
    const own = item(2, { relevance: { matched: 2, quality: 8 }, proximity: 3 });
    const family = item(3, { relevance: { matched: 2, quality: 8 }, proximity: 2 });
    expect(rank([stranger, family, own]).map((r) => r.fixId)).toEqual([2, 3, 1]);
  });
  it('ranks a fix with few or no reports as neutral: below a proven fix, above one that mostly failed', () => {
    const proven = item(1, { benchScore: 0.8, benchReports: 20 });
    const failing = item(2, { benchScore: 0.1, benchReports: 20 });
    const fresh = item(3);
    const oneReport = item(4, { benchScore: 0.21, benchReports: 1 });
    expect(rank([failing, fresh, proven, oneReport]).map((r) => r.fixId)).toEqual([1, 3, 4, 2]);
    expect(benchKey(null)).toBe(NEUTRAL_BENCH_SCORE);
    expect(benchKey(0.21, FEW_REPORTS - 1)).toBe(NEUTRAL_BENCH_SCORE);
    expect(benchKey(0.21, FEW_REPORTS)).toBe(0.21);
  });
  it('breaks complete ties by fix id', () => {
    expect(rank([item(9), item(2), item(5)]).map((r) => r.fixId)).toEqual([2, 5, 9]);
  });

  const arbitrary = fc.record({
    fixId: fc.integer({ min: 1, max: 50 }),
    relevance: fc.record({ matched: fc.integer({ min: 0, max: 4 }), quality: fc.integer({ min: 0, max: 12 }) }),
    proximity: fc.constantFrom(0 as const, 1 as const, 2 as const, 3 as const),
    benchScore: fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { nil: null }),
    benchReports: fc.integer({ min: 0, max: 30 }),
  });
  test.prop([fc.array(arbitrary, { maxLength: 30 })])('gives the same order whatever order the candidates arrive in', (items) => {
    const unique = [...new Map(items.map((i) => [i.fixId, i])).values()];
    expect(rank(unique)).toEqual(rank([...unique].reverse()));
  });
  test.prop([arbitrary, arbitrary])('is antisymmetric', (a, b) => {
    fc.pre(a.fixId !== b.fixId);
    expect(Math.sign(compareRanked(a, b))).toBe(-Math.sign(compareRanked(b, a)));
  });
});

describe('relevanceFromScore with concepts', () => {
  it("counts the engine's score as the share of the query's concepts matched", () => {
    expect(relevanceFromScore(1, 3).matched).toBe(3);
    expect(relevanceFromScore(0.34, 3).matched).toBe(1);
    expect(relevanceFromScore(0.97).matched).toBe(0);
  });
});
