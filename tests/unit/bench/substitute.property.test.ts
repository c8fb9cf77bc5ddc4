// Property tests: more headroom never worsens the substitute verdict (monotonic in voltage and temperature).
import { describe, expect } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import { checkSubstitute, type CheckStatus, type SubstituteInput } from '@/lib/bench/substitute';

const rank: Record<CheckStatus, number> = { pass: 0, warn: 1, fail: 2 };

const specArb = fc.record(
  {
    capacitanceF: fc.constantFrom(10e-6, 47e-6, 100e-6, 470e-6, 1000e-6),
    ratedVoltageV: fc.constantFrom(6.3, 10, 16, 25, 35, 50, 63),
    temperatureC: fc.constantFrom(85, 105, 125),
    lowEsr: fc.boolean(),
    rippleCurrentA: fc.double({ min: 0.05, max: 3, noNaN: true }),
    diameterMm: fc.constantFrom(5, 6.3, 8, 10),
    polarity: fc.constantFrom('polarised' as const, 'bipolar' as const),
  },
  { requiredKeys: ['capacitanceF', 'ratedVoltageV'] },
);

const inputArb = fc.record({
  original: specArb,
  candidate: specArb,
  workingVoltageV: fc.option(fc.double({ min: 1, max: 60, noNaN: true }), { nil: undefined }),
});

function verdictRank(input: SubstituteInput): number {
  const result = checkSubstitute(input);
  if (!result.ok) throw new Error(result.error.message);
  return rank[result.value.verdict];
}

describe('substitute check monotonicity', () => {
  test.prop([inputArb, fc.double({ min: 0, max: 400, noNaN: true })])(
    'a higher candidate voltage never worsens the verdict',
    (input, extraV) => {
      const higher = { ...input, candidate: { ...input.candidate, ratedVoltageV: input.candidate.ratedVoltageV + extraV } };
      expect(verdictRank(higher)).toBeLessThanOrEqual(verdictRank(input));
    },
  );

  test.prop([inputArb, fc.integer({ min: 0, max: 50 })])(
    'a higher candidate temperature class never worsens the verdict',
    (input, extraC) => {
      const temperatureC = Math.min(200, (input.candidate.temperatureC ?? 85) + extraC);
      const base = { ...input, candidate: { ...input.candidate, temperatureC: input.candidate.temperatureC ?? 85 } };
      const hotter = { ...base, candidate: { ...base.candidate, temperatureC } };
      expect(verdictRank(hotter)).toBeLessThanOrEqual(verdictRank(base));
    },
  );

  test.prop([inputArb])('the verdict is the worst of the checks', (input) => {
    const result = checkSubstitute(input);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const worst = Math.max(0, ...result.value.checks.map((c) => rank[c.status]));
    expect(rank[result.value.verdict]).toBe(worst);
    expect(result.value.checks.every((c) => c.reason.length > 0)).toBe(true);
  });
});
