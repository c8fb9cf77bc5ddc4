// Unit tests of the tolerance and temperature-class readers.
import { describe, expect, it } from 'vitest';
import { formatTolerance, parseTolerance, sameTolerance, toleranceFromLetter } from '@/lib/values/tolerance';
import { formatTemperature, parseTemperature } from '@/lib/values/temperature';

describe('parseTolerance', () => {
  it('reads the letters F G J K M Z', () => {
    expect(parseTolerance('F')).toEqual({ ok: true, value: { minusPercent: 1, plusPercent: 1 } });
    expect(parseTolerance('G')).toEqual({ ok: true, value: { minusPercent: 2, plusPercent: 2 } });
    expect(parseTolerance('J')).toEqual({ ok: true, value: { minusPercent: 5, plusPercent: 5 } });
    expect(parseTolerance('K')).toEqual({ ok: true, value: { minusPercent: 10, plusPercent: 10 } });
    expect(parseTolerance('M')).toEqual({ ok: true, value: { minusPercent: 20, plusPercent: 20 } });
    expect(parseTolerance('Z')).toEqual({ ok: true, value: { minusPercent: 20, plusPercent: 80 } });
  });

  it('reads symmetric and asymmetric percent forms', () => {
    for (const text of ['±10%', '± 10 %', '+/-10%', '+-10%', '10%', '10 %']) {
      expect(parseTolerance(text), text).toEqual({ ok: true, value: { minusPercent: 10, plusPercent: 10 } });
    }
    for (const text of ['+80/-20%', '+80% -20%', '+80/\u221220 %', '-20/+80%']) {
      expect(parseTolerance(text), text).toEqual({ ok: true, value: { minusPercent: 20, plusPercent: 80 } });
    }
  });

  it('refuses unknown letters, empty text and impossible tolerances', () => {
    expect(parseTolerance('Q').ok).toBe(false);
    expect(parseTolerance('').ok).toBe(false);
    expect(parseTolerance('ten percent').ok).toBe(false);
    const impossible = parseTolerance('+10/-120%');
    expect(impossible.ok).toBe(false);
    if (!impossible.ok) expect(impossible.error.example).toMatch(/±10 %/);
  });

  it('knows letters in either case', () => {
    expect(toleranceFromLetter('k')).toEqual({ minusPercent: 10, plusPercent: 10 });
    expect(toleranceFromLetter('x')).toBeUndefined();
  });
});

describe('formatTolerance', () => {
  it('writes one form for each kind of tolerance', () => {
    expect(formatTolerance({ minusPercent: 10, plusPercent: 10 })).toBe('±10 %');
    expect(formatTolerance({ minusPercent: 20, plusPercent: 80 })).toBe('+80/-20 %');
  });

  it('compares tolerances by value', () => {
    expect(sameTolerance({ minusPercent: 5, plusPercent: 5 }, { minusPercent: 5, plusPercent: 5 })).toBe(true);
    expect(sameTolerance({ minusPercent: 5, plusPercent: 5 }, undefined)).toBe(false);
    expect(sameTolerance(undefined, undefined)).toBe(true);
  });
});

describe('parseTemperature', () => {
  it('reads the class in its spellings', () => {
    for (const [text, celsius] of [
      ['85C', 85],
      ['85 C', 85],
      ['105°C', 105],
      ['105 °C', 105],
      ['105ºC', 105],
      ['125 deg C', 125],
      ['-40~+105°C', 105],
      ['-40/+85 °C', 85],
      ['\u221225 to +85 C', 85],
    ] as const) {
      expect(parseTemperature(text), text).toEqual({ ok: true, value: celsius });
    }
  });

  it('refuses text that is not a class and classes no part has', () => {
    expect(parseTemperature('hot').ok).toBe(false);
    expect(parseTemperature('').ok).toBe(false);
    expect(parseTemperature('20C').ok).toBe(false);
    expect(parseTemperature('999C').ok).toBe(false);
  });

  it('writes "105 °C"', () => {
    expect(formatTemperature(105)).toBe('105 °C');
  });
});
