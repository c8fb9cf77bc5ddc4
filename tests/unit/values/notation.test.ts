// Unit tests of the notation helpers: decimal commas, slashes between value and rating, mixed notations.
import { describe, expect, it } from 'vitest';
import { readDecimalCommas } from '@/lib/values/decimal-comma';
import { describePart } from '@/lib/values/describe-part';
import { refuseMixedNotation } from '@/lib/values/mixed-notation';
import { parseRating, splitAtSlashes } from '@/lib/values/rating';

describe('readDecimalCommas', () => {
  it('turns a comma between digits into a point', () => {
    expect(readDecimalCommas('4,7 uF')).toEqual({ ok: true, value: '4.7 uF' });
    expect(readDecimalCommas('6,3V 105C')).toEqual({ ok: true, value: '6.3V 105C' });
    expect(readDecimalCommas('0,1234 F')).toEqual({ ok: true, value: '0.1234 F' });
  });

  it('leaves commas that separate items alone', () => {
    expect(readDecimalCommas('16V, 105C')).toEqual({ ok: true, value: '16V, 105C' });
  });

  it('refuses three digits after a comma, and numbers with several separators', () => {
    expect(readDecimalCommas('2,200 uF').ok).toBe(false);
    expect(readDecimalCommas('10,000 h').ok).toBe(false);
    expect(readDecimalCommas('1.000,5 uF').ok).toBe(false);
    expect(readDecimalCommas('1,000,000 pF').ok).toBe(false);
  });
});

describe('splitAtSlashes', () => {
  it('splits a value from its ratings but keeps fractions and tolerance ranges', () => {
    expect(splitAtSlashes('100uF/16V/105C')).toBe('100uF 16V 105C');
    expect(splitAtSlashes('2k2/1/4W')).toBe('2k2 1/4W');
    expect(splitAtSlashes('1/4W')).toBe('1/4W');
    expect(splitAtSlashes('+80/-20%')).toBe('+80/-20%');
    expect(splitAtSlashes('-40/+105C')).toBe('-40/+105C');
  });

  it('lets a rating hold a fraction of a watt', () => {
    const rating = parseRating('1/4W 5%');
    expect(rating.ok && rating.value.powerW).toBe(0.25);
  });
});

describe('refuseMixedNotation', () => {
  it('passes one notation, with or without a tolerance letter', () => {
    for (const text of ['4k7', '4K7J', '4K7F', 'R47', '4.7 kΩ', '47uF', '104K', '4K7 ±5%']) {
      expect(refuseMixedNotation(text), text).toBeUndefined();
    }
  });

  it('refuses a unit after an RKM code, a point beside an RKM letter, and two values', () => {
    for (const text of ['4k7Ω', '4R7 ohm', '4u7uF', '2u2 F', '1.5k5', '4u7 100nF', '2k2 4k7']) {
      const refused = refuseMixedNotation(text);
      expect(refused?.ok, text).toBe(false);
    }
  });
});

describe('refuseMixedNotation examples', () => {
  it("gives the expected quantity's example when the code is of another quantity", () => {
    const refused = refuseMixedNotation('4k7Ω5', 'capacitance');
    expect(refused?.ok === false && refused.error.example).toBe('4.7 µF, 4u7, 100nF or 104');
    const own = refuseMixedNotation('4k7Ω5', 'resistance');
    expect(own?.ok === false && own.error.example).toBe('4k7 or 4.7 kΩ');
  });
});

describe('describePart with a marking', () => {
  it('reads a resistor code and a capacitor voltage code as printed on the part', () => {
    const resistor = describePart('4702', '', { kind: 'resistor', marking: true });
    expect(resistor.ok && resistor.value.label).toBe('47 kΩ');
    const capacitor = describePart('470u', '1C 105C', { kind: 'capacitor', marking: true });
    expect(capacitor.ok && capacitor.value.label).toBe('470 µF 16 V 105 °C');
  });

  it('keeps parts-list meanings without the marking option', () => {
    const resistor = describePart('4702', '', { kind: 'resistor' });
    expect(resistor.ok && resistor.value.label).toBe('4.702 kΩ');
    expect(describePart('470u', '1C', { kind: 'capacitor' }).ok).toBe(false);
  });
});
