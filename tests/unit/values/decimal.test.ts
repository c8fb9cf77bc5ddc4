// Unit tests of the exact decimal helpers behind stable round trips.
import { describe, expect, it } from 'vitest';
import { canonicalMagnitude, decimalToNumber, roundSignificant, scaledDecimal } from '@/lib/values/decimal';

describe('scaledDecimal', () => {
  it('shifts the decimal point without floating-point noise', () => {
    expect(scaledDecimal(4.7e-6, -6)).toBe('4.7');
    expect(scaledDecimal(4700, 3)).toBe('4.7');
    expect(scaledDecimal(0.0047, -6)).toBe('4700');
    expect(scaledDecimal(4.7e-13, -12)).toBe('0.47');
    expect(scaledDecimal(0, 3)).toBe('0');
    expect(scaledDecimal(-2.5, 0)).toBe('-2.5');
  });
});

describe('canonicalMagnitude', () => {
  it('makes products and decimal literals equal', () => {
    expect(0.1 + 0.2 === 0.3).toBe(false); // why the helper exists
    expect(canonicalMagnitude(4.7 * 1e-6)).toBe(4.7e-6);
    expect(2.2 * 1e-9 === 2.2e-9).toBe(false);
    expect(canonicalMagnitude(2.2 * 1e-9)).toBe(2.2e-9);
    expect(canonicalMagnitude(0.1 + 0.2)).toBe(0.3);
    expect(canonicalMagnitude(0)).toBe(0);
  });
});

describe('decimalToNumber', () => {
  it('reads digits with a power of ten in one step', () => {
    expect(decimalToNumber('4.7', -6)).toBe(4.7e-6);
    expect(decimalToNumber('22', -12)).toBe(2.2e-11);
  });
});

describe('roundSignificant', () => {
  it('rounds for display and leaves zero and non-finite values alone', () => {
    expect(roundSignificant(0.265258238, 3)).toBe(0.265);
    expect(roundSignificant(0, 3)).toBe(0);
    expect(roundSignificant(Number.POSITIVE_INFINITY, 3)).toBe(Number.POSITIVE_INFINITY);
  });
});
