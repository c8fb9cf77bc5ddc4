// Unit tests of the canonical writer: one form per value, prefixes chosen by band.
import { describe, expect, it } from 'vitest';
import { canonicalPrefix, formatMagnitude, formatValue } from '@/lib/values/format-value';
import { parseValue } from '@/lib/values/parse-value';

function canonical(text: string): string {
  const result = parseValue(text);
  if (!result.ok) throw new Error(result.error.message);
  return formatValue(result.value);
}

describe('formatValue', () => {
  it('writes the canonical forms with a space, µ as U+00B5 and Ω as U+03A9', () => {
    expect(canonical('4u7')).toBe('4.7 \u00b5F');
    expect(canonical('2k2')).toBe('2.2 k\u03a9');
    expect(canonical('16WV')).toBe('16 V');
  });

  it('gives every spelling of a value the same form', () => {
    for (const text of ['4.7uF', '4.7 µF', '4u7', '475', '4.7 mfd', '4700nF', '0.0047mF']) {
      expect(canonical(text), text).toBe('4.7 µF');
    }
    for (const text of ['2k2', '2K2', '2.2k', '2200 ohm', '2.2 kΩ', '2200R']) {
      expect(canonical(text), text).toBe('2.2 kΩ');
    }
  });

  it('keeps electrolytic values in µF up to 0.01 F and writes memory-backup capacitors in F', () => {
    expect(canonical('4700uF')).toBe('4700 µF');
    expect(canonical('0.1F')).toBe('0.1 F');
    expect(canonical('100000uF')).toBe('0.1 F');
  });

  it('writes nF and pF below a microfarad', () => {
    expect(canonical('104')).toBe('100 nF');
    expect(canonical('0.1uF')).toBe('100 nF');
    expect(canonical('479')).toBe('4.7 pF');
    expect(canonical('478')).toBe('0.47 pF');
  });

  it('writes low resistances in ohms and only very low ones in milliohms', () => {
    expect(canonical('R47')).toBe('0.47 Ω');
    expect(canonical('0R')).toBe('0 Ω');
    expect(canonical('5 mohm')).toBe('5 mΩ');
  });

  it('writes resistor power ratings in watts down to 0.1 W', () => {
    expect(canonical('1/4W')).toBe('0.25 W');
    expect(canonical('1/8W')).toBe('0.125 W');
    expect(canonical('50mW')).toBe('50 mW');
  });

  it('appends the tolerance', () => {
    expect(canonical('100nF ±10%')).toBe('100 nF ±10 %');
    const coded = parseValue('104K', { expect: 'capacitance' });
    expect(coded.ok && formatValue(coded.value)).toBe('100 nF ±10 %');
    expect(canonical('100nF +80/-20%')).toBe('100 nF +80/-20 %');
  });

  it('writes no floating-point noise', () => {
    expect(formatMagnitude({ quantity: 'capacitance', magnitude: 0.1 + 0.2, unit: 'F' })).toBe('0.3 F');
    expect(formatMagnitude({ quantity: 'capacitance', magnitude: 4.7 * 1e-6, unit: 'F' })).toBe('4.7 µF');
  });

  it('says so instead of printing NaN', () => {
    expect(formatMagnitude({ quantity: 'voltage', magnitude: Number.NaN, unit: 'V' })).toBe('not a value');
  });
});

describe('canonicalPrefix', () => {
  it('chooses the highest band the value reaches', () => {
    expect(canonicalPrefix(999e-9, 'capacitance')).toBe('n');
    expect(canonicalPrefix(1e-6, 'capacitance')).toBe('µ');
    expect(canonicalPrefix(999, 'resistance')).toBe('');
    expect(canonicalPrefix(1000, 'resistance')).toBe('k');
    expect(canonicalPrefix(0, 'resistance')).toBe('');
  });
});
