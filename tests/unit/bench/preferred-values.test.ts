// Unit tests of the preferred-value finder: neighbours, nearest value and error in any decade.
import { describe, expect, it } from 'vitest';
import { inDecade, isPreferred, nearestPreferred, seriesNames, seriesValues } from '@/lib/bench/preferred-values';

function match(value: number, series: Parameters<typeof nearestPreferred>[1]) {
  const result = nearestPreferred(value, series);
  if (!result.ok) throw new Error(result.error.message);
  return result.value;
}

describe('seriesValues', () => {
  it('has N values per decade, rising from 1.0 to below 10', () => {
    for (const name of seriesNames) {
      const values = seriesValues(name);
      expect(values.length).toBe(Number(name.slice(1)));
      expect(values[0]).toBe(1);
      expect(values.every((v, i) => i === 0 || v > (values[i - 1] ?? 0))).toBe(true);
      expect(values.every((v) => v >= 1 && v < 10)).toBe(true);
    }
  });

  it('nests each series in the next larger one', () => {
    const pairs = [
      ['E3', 'E6'],
      ['E6', 'E12'],
      ['E12', 'E24'],
      ['E48', 'E96'],
      ['E96', 'E192'],
    ] as const;
    for (const [smaller, larger] of pairs) {
      const superset = new Set(seriesValues(larger));
      expect(
        seriesValues(smaller).every((v) => superset.has(v)),
        `${smaller} in ${larger}`,
      ).toBe(true);
    }
  });
});

describe('nearestPreferred', () => {
  it('finds the neighbours and the nearest value in the value own decade', () => {
    expect(match(5100, 'E12')).toEqual({
      series: 'E12',
      value: 5100,
      nearest: 4700,
      below: 4700,
      above: 5600,
      errorPercent: -7.8431372549,
    });
    expect(match(5300, 'E12')).toMatchObject({ nearest: 5600, below: 4700, above: 5600 });
  });

  it('returns the value itself when it is in the series', () => {
    expect(match(4.7e-6, 'E6')).toMatchObject({ nearest: 4.7e-6, below: 4.7e-6, above: 4.7e-6, errorPercent: 0 });
    expect(match(1000, 'E24')).toMatchObject({ nearest: 1000, below: 1000, above: 1000 });
  });

  it('crosses into the next decade above the last series value', () => {
    expect(match(9.9e-6, 'E6')).toMatchObject({ nearest: 1e-5, below: 6.8e-6, above: 1e-5 });
    expect(match(96, 'E24')).toMatchObject({ nearest: 100, below: 91, above: 100 });
  });

  it('works in small and large decades without floating-point drift', () => {
    expect(match(3.4e-12, 'E12')).toMatchObject({ nearest: 3.3e-12 });
    expect(match(2.05e6, 'E24')).toMatchObject({ nearest: 2e6, below: 2e6, above: 2.2e6 });
    expect(match(0.001, 'E12')).toMatchObject({ nearest: 0.001, below: 0.001, above: 0.001 });
  });

  it('gives a tie to the lower value', () => {
    expect(match(1.6, 'E3')).toMatchObject({ nearest: 1, below: 1, above: 2.2 });
  });

  it('refuses zero, negative and non-finite values and unknown series', () => {
    expect(nearestPreferred(0, 'E12').ok).toBe(false);
    expect(nearestPreferred(-4.7, 'E12').ok).toBe(false);
    expect(nearestPreferred(Number.NaN, 'E12').ok).toBe(false);
    expect(nearestPreferred(Number.POSITIVE_INFINITY, 'E12').ok).toBe(false);
    expect(nearestPreferred(1e300, 'E12').ok).toBe(false);
    expect(nearestPreferred(4.7, 'E7' as never).ok).toBe(false);
  });
});

describe('isPreferred and inDecade', () => {
  it('tell series members from other values', () => {
    expect(isPreferred(4700, 'E12')).toBe(true);
    expect(isPreferred(5100, 'E12')).toBe(false);
    expect(isPreferred(5100, 'E24')).toBe(true);
    expect(inDecade('E6', 3)).toEqual([1000, 1500, 2200, 3300, 4700, 6800]);
    expect(inDecade('E3', -6)).toEqual([1e-6, 2.2e-6, 4.7e-6]);
  });
});
