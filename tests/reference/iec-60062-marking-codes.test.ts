// Reference checks of the value decoder against the marking codes of IEC 60062:2016.
import { describe, expect, it } from 'vitest';
import { formatValue } from '@/lib/values/format-value';
import { parseValue, type ParseOptions } from '@/lib/values/parse-value';
import { toleranceLetters } from '@/lib/values/tolerance';

function canonical(code: string, options: ParseOptions = {}): string {
  const result = parseValue(code, options);
  if (!result.ok) throw new Error(result.error.message);
  return formatValue(result.value);
}

describe('IEC 60062 RKM code', () => {
  it.each([
    ['4R7', '4.7 Ω'], // IEC 60062:2016 RKM code example
    ['R47', '0.47 Ω'], // IEC 60062:2016 RKM code, letter in first place
    ['4K7', '4.7 kΩ'], // IEC 60062:2016 RKM code example
    ['4M7', '4.7 MΩ'], // IEC 60062:2016 RKM code example
    ['2k2', '2.2 kΩ'], // IEC 60062:2016 RKM code (lower-case k as written on parts lists)
    ['4u7', '4.7 µF'], // IEC 60062:2016 RKM code for capacitance
    ['4n7', '4.7 nF'], // IEC 60062:2016 RKM code for capacitance
    ['4p7', '4.7 pF'], // IEC 60062:2016 RKM code for capacitance
  ])('%s is %s', (code, value) => {
    expect(canonical(code)).toBe(value);
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

describe('IEC 60062 tolerance letters', () => {
  it('maps F G J K M Z to 1, 2, 5, 10, 20 % and +80/-20 %', () => {
    // IEC 60062:2016 table of tolerance letter codes
    expect(toleranceLetters).toEqual({
      F: { minusPercent: 1, plusPercent: 1 },
      G: { minusPercent: 2, plusPercent: 2 },
      J: { minusPercent: 5, plusPercent: 5 },
      K: { minusPercent: 10, plusPercent: 10 },
      M: { minusPercent: 20, plusPercent: 20 },
      Z: { minusPercent: 20, plusPercent: 80 },
    });
  });

  it('reads a code with its tolerance letter', () => {
    expect(canonical('104K', { expect: 'capacitance' })).toBe('100 nF ±10 %'); // IEC 60062:2016 code plus letter
    expect(canonical('473J')).toBe('47 nF ±5 %'); // IEC 60062:2016 code plus letter
    expect(canonical('4K7F')).toBe('4.7 kΩ ±1 %'); // IEC 60062:2016 RKM plus letter
  });
});
