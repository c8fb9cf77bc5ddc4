// Reference checks of the value decoder against the marking codes of IEC 60062:2016 and the notations of parts lists.
// Each expected value names its source; "from memory" marks a value recalled rather than read from the source.
import { describe, expect, it } from 'vitest';
import { describePart, type DescribeOptions } from '@/lib/values/describe-part';
import { formatValue } from '@/lib/values/format-value';
import { parseValue, type ParseOptions } from '@/lib/values/parse-value';
import { toleranceLetters } from '@/lib/values/tolerance';
import { voltageCodes } from '@/lib/values/voltage-codes';

function canonical(code: string, options: ParseOptions = {}): string {
  const result = parseValue(code, options);
  if (!result.ok) throw new Error(result.error.message);
  return formatValue(result.value);
}

function label(value: string, rating = '', options: DescribeOptions = {}): string {
  const result = describePart(value, rating, options);
  if (!result.ok) throw new Error(result.error.message);
  return result.value.label;
}

function refusal(text: string, options: ParseOptions = {}): { message: string; example: string } {
  const result = parseValue(text, options);
  if (result.ok) throw new Error(`expected "${text}" to be refused, got ${formatValue(result.value)}`);
  return result.error;
}

describe('IEC 60062 RKM code', () => {
  it.each([
    ['4R7', '4.7 Ω'], // IEC 60062:2016 RKM code example
    ['R47', '0.47 Ω'], // IEC 60062:2016 RKM code, letter in first place
    ['4K7', '4.7 kΩ'], // IEC 60062:2016 RKM code example
    ['4M7', '4.7 MΩ'], // IEC 60062:2016 RKM code example
    ['2k2', '2.2 kΩ'], // IEC 60062:2016 RKM code (lower-case k as written on parts lists: common practice)
    ['1G0', '1 GΩ'], // IEC 60062:2016 RKM letter G (from memory)
    ['1T5', '1.5 TΩ'], // IEC 60062:2016 RKM letter T (from memory)
    ['4u7', '4.7 µF'], // IEC 60062:2016 RKM code for capacitance
    ['4n7', '4.7 nF'], // IEC 60062:2016 RKM code for capacitance
    ['4p7', '4.7 pF'], // IEC 60062:2016 RKM code for capacitance
    ['p68', '0.68 pF'], // IEC 60062:2016 RKM code, letter in first place (from memory)
    ['1F5', '1.5 F'], // IEC 60062:2016 RKM letter F for farads (from memory)
  ])('%s is %s', (code, value) => {
    expect(canonical(code)).toBe(value);
  });

  it('reads m as milli of the expected quantity', () => {
    expect(canonical('4m7', { expect: 'capacitance' })).toBe('4700 µF'); // IEC 60062:2016 RKM letter m (from memory)
  });
});

describe('IEC 60062 three-digit capacitance code (pF)', () => {
  it.each([
    ['104', '100 nF'], // IEC 60062:2016: 10 × 10^4 pF
    ['475', '4.7 µF'], // IEC 60062:2016: 47 × 10^5 pF
    ['223', '22 nF'], // IEC 60062:2016: 22 × 10^3 pF
    ['101', '100 pF'], // IEC 60062:2016: 10 × 10^1 pF
    ['479', '4.7 pF'], // IEC 60062:2016: multiplier 9 means ×0.1
    ['478', '0.47 pF'], // IEC 60062:2016: multiplier 8 means ×0.01
  ])('%s is %s', (code, value) => {
    expect(canonical(code, { expect: 'capacitance' })).toBe(value);
  });
});

describe('IEC 60062 resistance codes on a marking', () => {
  const marking = { expect: 'resistance', marking: true } as const;

  it.each([
    ['472', '4.7 kΩ'], // IEC 60062:2016 three-digit code: 47 × 10^2 Ω (from memory)
    ['100', '10 Ω'], // IEC 60062:2016 three-digit code: 10 × 10^0 Ω (from memory)
    ['105', '1 MΩ'], // IEC 60062:2016 three-digit code: 10 × 10^5 Ω (from memory)
    ['4702', '47 kΩ'], // IEC 60062:2016 four-digit code: 470 × 10^2 Ω (from memory)
    ['1001', '1 kΩ'], // IEC 60062:2016 four-digit code: 100 × 10^1 Ω (from memory)
    ['49R9', '49.9 Ω'], // IEC 60062:2016: R as the point on low values (from memory)
    ['1003F', '100 kΩ ±1 %'], // IEC 60062:2016 four-digit code with tolerance letter F (from memory)
  ])('%s printed on a resistor is %s', (code, value) => {
    expect(canonical(code, marking)).toBe(value);
  });

  it('reads the same digits on a parts list as plain ohms', () => {
    expect(canonical('472', { expect: 'resistance' })).toBe('472 Ω'); // common practice: parts lists give ohms
    expect(canonical('4700', { expect: 'resistance' })).toBe('4.7 kΩ'); // common practice
  });

  it('refuses the capacitor multipliers 8 and 9 on a resistor', () => {
    expect(refusal('479', marking).message).toMatch(/multiplier 9.*R for the point/); // IEC 60062:2016 (from memory)
  });

  it('asks which part three printed digits belong to when no part is named', () => {
    expect(refusal('472', { marking: true }).message).toMatch(/say which part/); // both readings in IEC 60062:2016
  });
});

describe('IEC 60062 tolerance letters', () => {
  it('maps the letters to their percentages', () => {
    expect(toleranceLetters).toEqual({
      B: { minusPercent: 0.1, plusPercent: 0.1 }, // IEC 60062:2016 (from memory)
      C: { minusPercent: 0.25, plusPercent: 0.25 }, // IEC 60062:2016 (from memory)
      D: { minusPercent: 0.5, plusPercent: 0.5 }, // IEC 60062:2016 (from memory)
      F: { minusPercent: 1, plusPercent: 1 }, // IEC 60062:2016
      G: { minusPercent: 2, plusPercent: 2 }, // IEC 60062:2016
      J: { minusPercent: 5, plusPercent: 5 }, // IEC 60062:2016
      K: { minusPercent: 10, plusPercent: 10 }, // IEC 60062:2016
      M: { minusPercent: 20, plusPercent: 20 }, // IEC 60062:2016
      N: { minusPercent: 30, plusPercent: 30 }, // IEC 60062:2016 (from memory)
      Z: { minusPercent: 20, plusPercent: 80 }, // IEC 60062:2016
    });
  });

  it('reads a code with its tolerance letter', () => {
    expect(canonical('104K', { expect: 'capacitance' })).toBe('100 nF ±10 %'); // IEC 60062:2016 code plus letter
    expect(canonical('473J')).toBe('47 nF ±5 %'); // IEC 60062:2016 code plus letter
    expect(canonical('4K7F')).toBe('4.7 kΩ ±1 %'); // IEC 60062:2016 RKM plus letter
    expect(canonical('4K7B')).toBe('4.7 kΩ ±0.1 %'); // IEC 60062:2016 RKM plus letter B (from memory)
    expect(canonical('224Z', { expect: 'capacitance' })).toBe('220 nF +80/-20 %'); // IEC 60062:2016 code plus letter Z
  });

  it('refuses B to G on a capacitor below 10 pF, where they are picofarads, not percent', () => {
    // IEC 60062:2016: below 10 pF, B ±0.1 pF, C ±0.25 pF, D ±0.5 pF, F ±1 pF, G ±2 pF (from memory)
    expect(refusal('4p7C').message).toMatch(/below 10 pF .* tolerance in picofarads/);
    expect(canonical('4p7J')).toBe('4.7 pF ±5 %'); // J has no picofarad meaning (from memory)
  });
});

describe('voltage notations', () => {
  it.each([
    ['16V', '16 V'], // common practice on electrolytic cans
    ['16 V', '16 V'], // SI Brochure, 9th ed.: a space between number and unit
    ['16 WV', '16 V'], // common practice: working voltage on electrolytic cans
    ['16WVDC', '16 V'], // common practice
    ['6,3 V', '6.3 V'], // SI Brochure, 9th ed.: the decimal marker may be a comma (from memory)
  ])('%s is %s', (text, value) => {
    expect(canonical(text, { expect: 'voltage' })).toBe(value);
  });

  it.each([
    ['1C', 16], // EIA-198 voltage code (from memory)
    ['1E', 25], // EIA-198 voltage code (from memory)
    ['0J', 6.3], // EIA-198 voltage code (from memory)
    ['2G', 400], // EIA-198 voltage code (from memory)
    ['2J', 630], // EIA-198 voltage code (from memory)
  ])('the marking code %s is %s V', (code, volts) => {
    expect(voltageCodes[code]).toBe(volts);
    expect(canonical(code, { expect: 'voltage', marking: true })).toBe(`${volts} V`);
    expect(label('470u', code, { kind: 'capacitor', marking: true })).toBe(`470 µF ${volts} V`);
  });

  it('refuses a voltage code that is also a plain value', () => {
    // "1V" is the EIA-198 code for 35 V (from memory) and also 1 volt
    expect(refusal('1V', { expect: 'voltage', marking: true }).message).toMatch(/code for 35 V .*also reads as 1 V/);
    expect(describePart('100n', '2A', { kind: 'capacitor', marking: true }).ok).toBe(false); // 2A: 100 V or 2 A
  });

  it('reads no voltage code from a parts list', () => {
    expect(parseValue('1C', { expect: 'voltage' }).ok).toBe(false); // codes belong to markings: common practice
  });
});

describe('decimal comma', () => {
  it.each([
    ['4,7µF', '4.7 µF'], // SI Brochure, 9th ed.: comma as the decimal marker (from memory)
    ['4,7 kΩ', '4.7 kΩ'], // SI Brochure, 9th ed. (from memory)
    ['0,47 µF', '470 nF'], // SI Brochure, 9th ed. (from memory)
    ['2,2k', '2.2 kΩ'], // SI Brochure, 9th ed. (from memory)
  ])('%s is %s', (text, value) => {
    expect(canonical(text)).toBe(value);
  });

  it('refuses a comma that could be a thousands separator', () => {
    const error = refusal('4,700 µF'); // ambiguous between the SI Brochure's decimal comma and a digit group
    expect(error.message).toBe('"4,700" could be 4.7 (a decimal comma) or 4700 (a thousands separator); write it without the comma.');
    expect(error.example).toMatch(/4700 µF/);
  });
});

describe('value and rating in one cell, as on parts lists', () => {
  it.each([
    ['100uF/16V', '100 µF 16 V'], // common practice
    ['100µF 16V 105°C', '100 µF 16 V 105 °C'], // common practice
    ['47u 25v', '47 µF 25 V'], // common practice
    ['2k2 1/4W 5%', '2.2 kΩ ±5 % 0.25 W'], // common practice
    ['470uF/16V/105C', '470 µF 16 V 105 °C'], // common practice
    ['4,7µF 6,3V', '4.7 µF 6.3 V'], // common practice with the SI Brochure's decimal comma (from memory)
    ['104K 100V', '100 nF ±10 % 100 V'], // IEC 60062:2016 code plus letter, then the voltage
  ])('%s is %s', (text, value) => {
    const options: DescribeOptions = text.startsWith('104') ? { kind: 'capacitor' } : {};
    expect(label(text, '', options)).toBe(value);
  });
});

describe('mixed notations are refused with a reason and an example', () => {
  it.each([
    ['4k7Ω5', /mixes an RKM code with a unit/, '4k7 or 4.7 kΩ'], // IEC 60062:2016: the letter replaces the unit
    ['1k5R', /mixes an RKM code with a unit/, '1k5 or 1.5 kΩ'], // IEC 60062:2016
    ['4k7 Ω', /mixes an RKM code with a unit/, '4k7 or 4.7 kΩ'], // IEC 60062:2016
    ['4u7 100nF', /more than one value/, '4u7 or 4.7 µF'], // two values in one field
    ['4.7k7', /decimal point and an RKM letter/, '4.7k or 4k7'], // IEC 60062:2016: the letter is the point
    ['4u7F', /F for farads or in F, the tolerance letter/, '4u7, 4.7 µF or 4u7 ±1 %'], // IEC 60062:2016: F is also ±1 %
  ])('%s', (text, message, example) => {
    const error = refusal(text);
    expect(error.message).toMatch(message);
    expect(error.message).toMatch(/[.;]/);
    expect(error.example).toBe(example);
  });
});
