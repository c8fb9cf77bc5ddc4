// Unit tests of describePart: canonical specs and grouping keys for parts-table rows.
import { describe, expect, it } from 'vitest';
import { describePart } from '@/lib/values/describe-part';
import type { DescribeOptions } from '@/lib/values/describe-part';
import type { PartSpec } from '@/lib/values/part-spec';

function specOf(value: string, rating: string, options: DescribeOptions = {}): PartSpec {
  const result = describePart(value, rating, options);
  if (!result.ok) throw new Error(`expected "${value}" / "${rating}" to decode: ${result.error.message}`);
  return result.value;
}

describe('describePart', () => {
  it('decodes value and rating into a canonical spec', () => {
    expect(specOf('470uF', '16V 105C low-ESR', { kind: 'capacitor' })).toEqual({
      kind: 'electrical',
      quantity: 'capacitance',
      magnitude: 4.7e-4,
      unit: 'F',
      voltage: 16,
      temperatureC: 105,
      lowEsr: true,
      words: [],
      label: '470 µF 16 V 105 °C low-ESR',
      key: 'capacitance:470 µF 16 V 105 °C low-ESR',
    });
  });

  it('gives equal parts written differently the same key', () => {
    const keys = [
      specOf('470uF', '16V 105C low-ESR').key,
      specOf('470 µF', '16 V, 105 °C, low ESR').key,
      specOf('470uF 16V', '105°C LOW-ESR').key,
      specOf('0.47mF', 'low-esr 16WV 105 C').key,
    ];
    expect(new Set(keys).size).toBe(1);
  });

  it('gives different parts different keys', () => {
    expect(specOf('470uF', '16V').key).not.toBe(specOf('470uF', '25V').key);
    expect(specOf('470uF', '16V 85C').key).not.toBe(specOf('470uF', '16V 105C').key);
    expect(specOf('470uF', '16V').key).not.toBe(specOf('470uF', '16V low-ESR').key);
    expect(specOf('470uF', '16V radial').key).not.toBe(specOf('470uF', '16V axial').key);
  });

  it('merges a tolerance from the value with the rating and refuses two different ones', () => {
    expect(specOf('104K', '50V', { kind: 'capacitor' })).toMatchObject({ tolerance: { minusPercent: 10 }, label: '100 nF ±10 % 50 V' });
    expect(specOf('100nF', '10% 50V')).toMatchObject({ label: '100 nF ±10 % 50 V' });
    const clash = describePart('100nF 10%', '±5%');
    expect(clash.ok).toBe(false);
  });

  it('reads resistors with power and tolerance', () => {
    expect(specOf('2k2', '0.25W 1%', { kind: 'resistor' })).toMatchObject({
      quantity: 'resistance',
      magnitude: 2200,
      powerW: 0.25,
      label: '2.2 kΩ ±1 % 0.25 W',
    });
    expect(specOf('100K', '', { kind: 'resistor' })).toMatchObject({ magnitude: 100000 });
  });

  it('refuses a value of the wrong quantity for the part kind', () => {
    const result = describePart('2k2', '', { kind: 'capacitor' });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error.message).toMatch(/resistance, but a capacitance/);
  });

  it('refuses mixed units and unreadable values, with an example', () => {
    for (const [value, rating] of [
      ['47uF 16k', ''],
      ['47x', '16V'],
      ['', '16V'],
      ['47uF', '16X'],
    ] as const) {
      const result = describePart(value, rating, { kind: 'capacitor' });
      expect(result.ok, `${value} ${rating}`).toBe(false);
      if (!result.ok) expect(result.error.example.length).toBeGreaterThan(0);
    }
  });

  it('falls back to a normalised text key for mechanical parts', () => {
    const belts = [
      specOf('flat belt 92 mm x 4 mm', '', { kind: 'belt' }),
      specOf('Flat belt 92mm x 4mm', '', { kind: 'belt' }),
      specOf('flat belt  92x4mm', '', { kind: 'belt' }),
      specOf('FLAT BELT 92 × 4 mm', '', { kind: 'belt' }),
    ];
    expect(new Set(belts.map((b) => b.key))).toEqual(new Set(['belt:flat belt 92 mm x 4 mm']));
    expect(belts[0]).toEqual({ kind: 'text', partKind: 'belt', label: 'flat belt 92 mm x 4 mm', key: 'belt:flat belt 92 mm x 4 mm' });
    expect(specOf('idler tyre 17 x 2,5 mm', 'rubber', { kind: 'idler_tyre' }).key).toBe('idler_tyre:idler tyre 17 mm x 2.5 mm rubber');
  });

  it('keeps the same text of different part kinds apart', () => {
    expect(specOf('17 x 2 mm', '', { kind: 'belt' }).key).not.toBe(specOf('17 x 2 mm', '', { kind: 'idler_tyre' }).key);
  });

  it('keys part numbers case-insensitively but labels them as written', () => {
    const ic = specOf('XQ-7400', '', { kind: 'ic' });
    expect(ic).toMatchObject({ kind: 'text', label: 'XQ-7400', key: 'ic:xq-7400' });
    expect(specOf('xq-7400', '', { kind: 'ic' }).key).toBe(ic.key);
  });

  it('decodes "other" parts with a value and falls back to text otherwise', () => {
    expect(specOf('10uH', '', { kind: 'other' })).toMatchObject({ kind: 'electrical', quantity: 'inductance' });
    expect(specOf('ZK-9 clip', '', { kind: 'other' })).toMatchObject({ kind: 'text', key: 'other:zk-9 clip' });
  });

  it('refuses a mechanical part with no text at all', () => {
    expect(describePart('', '', { kind: 'belt' }).ok).toBe(false);
  });
});
