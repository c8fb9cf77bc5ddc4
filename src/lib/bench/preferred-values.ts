// IEC 60063 preferred number series (E3 to E192) and the nearest preferred value to any positive value.
import { canonicalMagnitude } from '@/lib/values/decimal';
import { fail, ok, type Result } from '@/lib/values/result';

export const seriesNames = ['E3', 'E6', 'E12', 'E24', 'E48', 'E96', 'E192'] as const;
export type SeriesName = (typeof seriesNames)[number];

/**
 * E3 to E24 as tabulated in IEC 60063. They are a table, not a formula: E24 departs from
 * 10^(i/24) rounded to two figures at 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7 and 8.2, which predate the rule.
 */
const tabulated: Record<'E3' | 'E6' | 'E12' | 'E24', readonly number[]> = {
  E3: [1.0, 2.2, 4.7],
  E6: [1.0, 1.5, 2.2, 3.3, 4.7, 6.8],
  E12: [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2],
  E24: [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1],
};

/** E48, E96 and E192 follow the rule 10^(i/N) rounded to three significant figures. */
function ruleSeries(steps: number): number[] {
  return Array.from({ length: steps }, (_, i) => Number((10 ** (i / steps)).toPrecision(3)));
}

/**
 * The one published exception: at i = 185 the rule gives 10^(185/192) = 9.1948 → 9.19, but the
 * IEC 60063 table lists 9.20. Checked here by computation and against a published copy of the
 * table; the standard's own text was not at hand (from memory otherwise). E96 and E48 take every
 * second and fourth E192 step, so i = 185 is in neither of them.
 */
function e192(): number[] {
  const values = ruleSeries(192);
  values[185] = 9.2;
  return values;
}

const series: Record<SeriesName, readonly number[]> = {
  ...tabulated,
  E48: ruleSeries(48),
  E96: ruleSeries(96),
  E192: e192(),
};

/** The series' values in the decade 1 ≤ x < 10. */
export function seriesValues(name: SeriesName): readonly number[] {
  return series[name];
}

export interface PreferredMatch {
  series: SeriesName;
  value: number;
  /** The series value closest to the value (smallest absolute difference; a tie goes to the lower one). */
  nearest: number;
  /** The largest series value at or below the value. */
  below: number;
  /** The smallest series value at or above the value. */
  above: number;
  /** (nearest − value) / value × 100: negative when the nearest value is below. */
  errorPercent: number;
}

const EXAMPLE = '4700 (for 4.7 kΩ) or 0.000033 (for 33 µF), in base units';

export function nearestPreferred(value: number, name: SeriesName): Result<PreferredMatch> {
  if (!seriesNames.includes(name)) return fail(`"${String(name)}" is not a series.`, seriesNames.join(', '));
  if (typeof value !== 'number' || !Number.isFinite(value)) return fail('The value must be a number.', EXAMPLE);
  if (value <= 0) return fail('The value must be above zero.', EXAMPLE);
  if (value < 1e-15 || value > 1e15) return fail('The value is outside the range of components (1e-15 to 1e15).', EXAMPLE);
  const decade = decadeOf(value);
  const candidates = [...inDecade(name, decade), ...inDecade(name, decade + 1).slice(0, 1)];
  const below = Math.max(...candidates.filter((c) => c <= value));
  const above = Math.min(...candidates.filter((c) => c >= value));
  const nearest = above - value < value - below ? above : below;
  return ok({
    series: name,
    value,
    nearest,
    below,
    above,
    errorPercent: canonicalMagnitude(((nearest - value) / value) * 100),
  });
}

/** True when the value is exactly a member of the series (in any decade). */
export function isPreferred(value: number, name: SeriesName): boolean {
  const match = nearestPreferred(value, name);
  return match.ok && match.value.nearest === canonicalMagnitude(value);
}

/** The series' values in the decade 10^d ≤ x < 10^(d+1), written as decimals so 4.7e3 is exactly 4700. */
export function inDecade(name: SeriesName, decade: number): number[] {
  return series[name].map((mantissa) => Number(`${mantissa}e${decade}`));
}

/** The power of ten at or below the value, corrected where log10 rounds across a decade edge. */
function decadeOf(value: number): number {
  let decade = Math.floor(Math.log10(value));
  if (value < Number(`1e${decade}`)) decade -= 1;
  if (value >= Number(`1e${decade + 1}`)) decade += 1;
  return decade;
}
