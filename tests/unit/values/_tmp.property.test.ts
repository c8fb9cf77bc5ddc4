// Property tests: any spelling of a value reads back to one canonical form, and the canonical form reads back exactly.
import { describe, expect } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import { formatValue } from '@/lib/values/format-value';
import { parseValue } from '@/lib/values/parse-value';
import { magnitudeRange, type Quantity } from '@/lib/values/quantities';

/** Ways people write each unit, and the prefixes they put before it. */
const spellings: Record<Quantity, { units: string[]; prefixes: string[] }> = {
  capacitance: { units: ['F', ' F', 'f', ' farad'], prefixes: ['p', 'n', 'u', '\u00b5', '\u03bc', 'm', ''] },
  resistance: { units: ['Ω', ' ohm', 'ohms', '\u2126', 'R'], prefixes: ['m', '', 'k', 'K', 'M', 'G'] },
  voltage: { units: ['V', ' V', 'VDC', ' WV', 'V DC'], prefixes: ['m', '', 'k'] },
  inductance: { units: ['H', ' H'], prefixes: ['n', 'u', '\u00b5', 'm', ''] },
  power: { units: ['W', ' W', ' watt'], prefixes: ['m', '', 'k'] },
  current: { units: ['A', ' A', 'amp'], prefixes: ['u', 'm', ''] },
};

const quantityArb = fc.constantFrom<Quantity>('capacitance', 'resistance', 'voltage', 'inductance', 'power', 'current');

/** A number as typed: 1 to 4 significant digits, 0 to 3 decimals, e.g. "4.7", "470", "0.047". */
const numberTextArb = fc
  .tuple(fc.integer({ min: 1, max: 9999 }), fc.integer({ min: 0, max: 3 }))
  .map(([digits, decimals]) => (digits / 10 ** decimals).toFixed(decimals));

const writtenValueArb = quantityArb.chain((quantity) =>
  fc.record({
    quantity: fc.constant(quantity),
    number: numberTextArb,
    prefix: fc.constantFrom(...spellings[quantity].prefixes),
    unit: fc.constantFrom(...spellings[quantity].units),
    space: fc.constantFrom('', ' '),
  }),
);

/** A canonical magnitude inside the accepted range: up to 6 significant digits times a power of ten. */
const magnitudeArb = quantityArb.chain((quantity) => {
  const range = magnitudeRange(quantity);
  return fc
    .tuple(fc.integer({ min: 1, max: 999_999 }), fc.integer({ min: -20, max: 20 }))
    .map(([digits, exponent]) => ({ quantity, magnitude: Number(`${digits}e${exponent}`) }))
    .filter(({ magnitude }) => magnitude >= range.min && magnitude <= range.max);
});

describe('value round trips', () => {
  test.prop([writtenValueArb], { numRuns: 20000 })('format(parse(x)) is stable under a second parse and format', (written) => {
    const text = `${written.number}${written.space}${written.prefix}${written.unit}`;
    const first = parseValue(text, { expect: written.quantity });
    if (!first.ok) {
      // Only the range check may refuse a well-formed value, and it says so.
      expect(first.error.message).toMatch(/too (small|large)/);
      return;
    }
    const canonical = formatValue(first.value);
    const second = parseValue(canonical, { expect: written.quantity });
    expect(second.ok).toBe(true);
    if (!second.ok) return;
    expect(second.value.magnitude).toBe(first.value.magnitude);
    expect(formatValue(second.value)).toBe(canonical);
  });

  test.prop([magnitudeArb], { numRuns: 20000 })('parse(format(v)) gives v back exactly', ({ quantity, magnitude }) => {
    const unit = { capacitance: 'F', resistance: 'Ω', voltage: 'V', inductance: 'H', power: 'W', current: 'A' } as const;
    const text = formatValue({ quantity, magnitude, unit: unit[quantity] });
    const back = parseValue(text);
    expect(back).toEqual({ ok: true, value: { quantity, magnitude, unit: unit[quantity] } });
  });

  test.prop([fc.integer({ min: 0, max: 999 }), fc.integer({ min: 1, max: 99 }), fc.constantFrom('R', 'K', 'M', 'p', 'n', 'u')], { numRuns: 20000 })(
    'RKM codes read back from their canonical form',
    (before, after, letter) => {
      const code = `${before}${letter}${after}`;
      const first = parseValue(code);
      expect(first.ok).toBe(true);
      if (!first.ok) return;
      const again = parseValue(formatValue(first.value));
      expect(again.ok && again.value.magnitude).toBe(first.value.magnitude);
    },
  );

  test.prop([fc.integer({ min: 1, max: 9 }), fc.integer({ min: 0, max: 9 }), fc.integer({ min: 0, max: 9 })], { numRuns: 20000 })(
    'three-digit codes read as two figures times the multiplier, in pF',
    (first, second, multiplier) => {
      const result = parseValue(`${first}${second}${multiplier}`);
      const factor = multiplier === 8 ? 0.01 : multiplier === 9 ? 0.1 : 10 ** multiplier;
      expect(result.ok).toBe(true);
      if (!result.ok) return;
      expect(result.value.magnitude / ((first * 10 + second) * factor * 1e-12)).toBeCloseTo(1, 10);
    },
  );

  test.prop([fc.string({ maxLength: 12 })], { numRuns: 20000 })('never returns NaN or Infinity, whatever the text', (text) => {
    const result = parseValue(text);
    if (result.ok) expect(Number.isFinite(result.value.magnitude)).toBe(true);
    else expect(result.error.message.length).toBeGreaterThan(0);
  });
});
