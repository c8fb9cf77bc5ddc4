// Unit tests of the component value reader: SI forms, RKM codes, three-digit codes and refusals.
import { describe, expect, it } from 'vitest';
import { normaliseValueText, parseValue } from '@/lib/values/parse-value';
import type { ParseOptions } from '@/lib/values/parse-value';

function magnitudeOf(text: string, options: ParseOptions = {}): number {
  const result = parseValue(text, options);
  if (!result.ok) throw new Error(`expected "${text}" to parse: ${result.error.message}`);
  return result.value.magnitude;
}

function errorOf(text: string, options: ParseOptions = {}): { message: string; example: string } {
  const result = parseValue(text, options);
  if (result.ok) throw new Error(`expected "${text}" to be refused, got ${result.value.magnitude}`);
  return result.error;
}

describe('parseValue', () => {
  it('reads SI prefixes with and without a space before the unit', () => {
    expect(magnitudeOf('4.7uF')).toBe(4.7e-6);
    expect(magnitudeOf('4.7 uF')).toBe(4.7e-6);
    expect(magnitudeOf('100nF')).toBe(1e-7);
    expect(magnitudeOf('22 pF')).toBe(22e-12);
    expect(magnitudeOf('2.2kΩ')).toBe(2200);
    expect(magnitudeOf('4.7 MΩ')).toBe(4.7e6);
    expect(magnitudeOf('1 GΩ')).toBe(1e9);
    expect(magnitudeOf('10 mA')).toBe(0.01);
    expect(magnitudeOf('100 mH')).toBe(0.1);
    expect(magnitudeOf('1 kV')).toBe(1000);
  });

  it('treats u, the micro sign U+00B5 and Greek mu U+03BC alike', () => {
    expect(magnitudeOf('4.7uF')).toBe(4.7e-6);
    expect(magnitudeOf('4.7\u00b5F')).toBe(4.7e-6);
    expect(magnitudeOf('4.7\u03bcF')).toBe(4.7e-6);
  });

  it('reads mfd and MFD as microfarads and refuses MF as megafarads', () => {
    expect(magnitudeOf('10mfd')).toBe(1e-5);
    expect(magnitudeOf('10 MFD')).toBe(1e-5);
    expect(errorOf('10MF').message).toMatch(/megafarads/);
  });

  it('reads the spellings of ohms', () => {
    expect(magnitudeOf('470 ohm')).toBe(470);
    expect(magnitudeOf('470ohms')).toBe(470);
    expect(magnitudeOf('470R')).toBe(470);
    expect(magnitudeOf('2.2 kohm')).toBe(2200);
    expect(magnitudeOf('10\u2126')).toBe(10); // U+2126 OHM SIGN, folded to Ω
  });

  it('reads the voltage notations of electrolytic capacitors', () => {
    for (const text of ['16V', '16 V', '16VDC', '16 VDC', '16 V DC', '16WV', '16 WV', '16WVDC', '16 volts']) {
      expect(parseValue(text, { expect: 'voltage' })).toEqual({ ok: true, value: { quantity: 'voltage', magnitude: 16, unit: 'V' } });
    }
  });

  it('reads watts, fractions of a watt and amperes', () => {
    expect(magnitudeOf('0.25W')).toBe(0.25);
    expect(magnitudeOf('1/4W')).toBe(0.25);
    expect(magnitudeOf('1/8 W')).toBe(0.125);
    expect(magnitudeOf('1.5A')).toBe(1.5);
  });

  it('reads RKM codes with the letter as the decimal point', () => {
    expect(magnitudeOf('4R7')).toBe(4.7);
    expect(magnitudeOf('R47')).toBe(0.47);
    expect(magnitudeOf('4K7')).toBe(4700);
    expect(magnitudeOf('2k2')).toBe(2200);
    expect(magnitudeOf('4M7')).toBe(4.7e6);
    expect(magnitudeOf('4u7')).toBe(4.7e-6);
    expect(magnitudeOf('4n7')).toBe(4.7e-9);
    expect(magnitudeOf('4p7')).toBe(4.7e-12);
  });

  it('gives RKM capacitor letters to the expected quantity when it is not a capacitance', () => {
    expect(parseValue('4u7', { expect: 'inductance' })).toEqual({
      ok: true,
      value: { quantity: 'inductance', magnitude: 4.7e-6, unit: 'H' },
    });
    expect(magnitudeOf('4m7', { expect: 'capacitance' })).toBe(4.7e-3);
  });

  it('reads an RKM code followed by a tolerance letter', () => {
    expect(parseValue('4K7J')).toEqual({
      ok: true,
      value: { quantity: 'resistance', magnitude: 4700, unit: 'Ω', tolerance: { minusPercent: 5, plusPercent: 5 } },
    });
  });

  it('reads three-digit capacitance codes in picofarads', () => {
    expect(magnitudeOf('104')).toBe(1e-7);
    expect(magnitudeOf('475')).toBe(4.7e-6);
    expect(magnitudeOf('223')).toBe(2.2e-8);
    expect(magnitudeOf('100')).toBe(1e-11);
    expect(magnitudeOf('107')).toBe(1e-4);
  });

  it('reads multiplier digits 9 and 8 as ×0.1 and ×0.01', () => {
    expect(magnitudeOf('479')).toBe(4.7e-12);
    expect(magnitudeOf('478')).toBe(4.7e-13);
  });

  it('reads a tolerance letter after a three-digit code when a capacitance is expected', () => {
    expect(parseValue('104K', { expect: 'capacitance' })).toEqual({
      ok: true,
      value: { quantity: 'capacitance', magnitude: 1e-7, unit: 'F', tolerance: { minusPercent: 10, plusPercent: 10 } },
    });
    expect(parseValue('473J').ok && parseValue('473J')).toMatchObject({ value: { tolerance: { minusPercent: 5 } } });
  });

  it('refuses "104K" without a stated quantity, since it is also a resistor value', () => {
    expect(errorOf('104K').message).toMatch(/resistor .*capacitor/);
    expect(magnitudeOf('104K', { expect: 'resistance' })).toBe(104000);
  });

  it('reads a bare number as the expected quantity, except for capacitance', () => {
    expect(magnitudeOf('470', { expect: 'resistance' })).toBe(470);
    expect(magnitudeOf('16', { expect: 'voltage' })).toBe(16);
    expect(errorOf('4.7', { expect: 'capacitance' }).message).toMatch(/needs a unit/);
    expect(errorOf('4.7').message).toMatch(/needs a unit/);
  });

  it('reads a trailing tolerance in any of its spellings', () => {
    expect(parseValue('100nF ±10%')).toMatchObject({ ok: true, value: { tolerance: { minusPercent: 10, plusPercent: 10 } } });
    expect(parseValue('100nF 10%')).toMatchObject({ ok: true, value: { tolerance: { minusPercent: 10, plusPercent: 10 } } });
    expect(parseValue('100 nF +/-5 %')).toMatchObject({ ok: true, value: { tolerance: { minusPercent: 5, plusPercent: 5 } } });
    expect(parseValue('100nF +80/-20%')).toMatchObject({ ok: true, value: { tolerance: { minusPercent: 20, plusPercent: 80 } } });
  });

  it('keeps 0 Ω links and refuses other zero values', () => {
    expect(magnitudeOf('0R')).toBe(0);
    expect(magnitudeOf('0 ohm')).toBe(0);
    expect(errorOf('0uF').message).toMatch(/zero/);
    expect(errorOf('000').message).toMatch(/zero/);
  });

  it('refuses bad input with a message and an example', () => {
    const cases: Array<[string, RegExp]> = [
      ['47x', /"x" .* not a unit/],
      ['', /empty/],
      ['   ', /empty/],
      ['1e999', /too large/],
      ['1e999F', /too large/],
      ['1e-999F', /too small/],
      ['-47uF', /negative/],
      ['\u221247uF', /negative/],
      ['47uF 16k', /more than one value/],
      ['4,700uF', /could be 4.7 .* or 4700/],
      ['1,000,000pF', /several commas/],
      ['4.7uF, 16V', /not a decimal comma/],
      ['NaN', /number/],
      ['Infinity uF', /number/],
      ['uF', /number/],
      ['10kF', /prefix "k"/],
    ];
    for (const [text, message] of cases) {
      const error = errorOf(text);
      expect(error.message, text).toMatch(message);
      expect(error.example.length, text).toBeGreaterThan(0);
    }
  });

  it('refuses a value of another quantity than the one expected', () => {
    const error = errorOf('16V', { expect: 'capacitance' });
    expect(error.message).toBe('"16V" is a voltage, but a capacitance is expected here.');
    expect(error.example).toMatch(/µF/);
    expect(errorOf('4R7', { expect: 'capacitance' }).message).toMatch(/resistance/);
    expect(errorOf('2k2', { expect: 'capacitance' }).message).toMatch(/resistance/);
  });

  it('asks for a unit after a milli prefix alone', () => {
    expect(errorOf('4m7').message).toMatch(/no unit/);
    expect(errorOf('10m').message).toMatch(/no unit/);
  });

  it('never returns NaN or Infinity', () => {
    for (const text of ['1e308F', '1e400', '9'.repeat(400) + 'F', '0.' + '0'.repeat(400) + '1F', '1/0W']) {
      const result = parseValue(text);
      if (result.ok) expect(Number.isFinite(result.value.magnitude)).toBe(true);
      else expect(result.error.message.length).toBeGreaterThan(0);
    }
  });
});

describe('parseValue limits', () => {
  it('refuses text longer than any value on a parts row', () => {
    const result = parseValue(`${'1'.repeat(250)}uF`);
    expect(result.ok || result.error.message).toMatch(/longer than 200 characters/);
  });
});

describe('normaliseValueText', () => {
  it('folds micro signs, the ohm sign and minus signs and collapses spaces', () => {
    expect(normaliseValueText('  4.7\u00a0\u00b5F ')).toBe('4.7 uF');
    expect(normaliseValueText('4.7\u03bcF')).toBe('4.7uF');
    expect(normaliseValueText('10\u2126')).toBe('10Ω');
    expect(normaliseValueText('\u221247')).toBe('-47');
  });
});
