// Unit tests of the rating reader: voltage, temperature class, tolerance, low-ESR, size, pitch, life.
import { describe, expect, it } from 'vitest';
import { parseRating } from '@/lib/values/rating';

function fieldsOf(text: string) {
  const result = parseRating(text);
  if (!result.ok) throw new Error(`expected "${text}" to read: ${result.error.message}`);
  return result.value;
}

describe('parseRating', () => {
  it('reads voltage, temperature class and low-ESR from one line', () => {
    expect(fieldsOf('16V 105C low-ESR')).toEqual({ voltage: 16, temperatureC: 105, lowEsr: true, words: [] });
    expect(fieldsOf('16 V, 105 °C, low ESR')).toEqual({ voltage: 16, temperatureC: 105, lowEsr: true, words: [] });
    expect(fieldsOf('16WV/85C')).toEqual({ voltage: 16, temperatureC: 85, words: [] });
    expect(fieldsOf('16 V DC')).toEqual({ voltage: 16, words: [] });
  });

  it('reads tolerance, power and ripple current', () => {
    expect(fieldsOf('0.25W 1%')).toEqual({ powerW: 0.25, tolerance: { minusPercent: 1, plusPercent: 1 }, words: [] });
    expect(fieldsOf('±20% ripple 1.2A')).toEqual({
      tolerance: { minusPercent: 20, plusPercent: 20 },
      rippleCurrentA: 1.2,
      words: ['ripple'],
    });
  });

  it('reads can size, lead pitch and rated life', () => {
    expect(fieldsOf('Ø10x16mm P5 2000h')).toEqual({ diameterMm: 10, heightMm: 16, leadPitchMm: 5, lifeHours: 2000, words: [] });
    expect(fieldsOf('10 x 20 mm 5mm pitch')).toEqual({ diameterMm: 10, heightMm: 20, leadPitchMm: 5, words: [] });
  });

  it('reads bipolar markings', () => {
    expect(fieldsOf('50V NP').bipolar).toBe(true);
    expect(fieldsOf('50V bi-polar').bipolar).toBe(true);
    expect(fieldsOf('50V non-polarised').bipolar).toBe(true);
    expect(fieldsOf('50V polarised').bipolar).toBe(false);
  });

  it('takes the upper limit of a category temperature range', () => {
    expect(fieldsOf('-40~+105°C').temperatureC).toBe(105);
  });

  it('keeps other words, in lower case and in order', () => {
    expect(fieldsOf('16V Radial snap-in').words).toEqual(['radial', 'snap-in']);
  });

  it('reads an empty rating as no fields', () => {
    expect(fieldsOf('')).toEqual({ words: [] });
  });

  it('refuses contradictions and values that belong in the value column', () => {
    const twoVoltages = parseRating('16V 25V');
    expect(twoVoltages.ok || twoVoltages.error.message).toMatch(/two different voltages/);
    const capacitance = parseRating('470uF');
    expect(capacitance.ok || capacitance.error.message).toMatch(/holds a capacitance \(470 µF\)/);
    const resistance = parseRating('16k');
    expect(resistance.ok || resistance.error.message).toMatch(/holds a resistance/);
    const unreadable = parseRating('16X');
    expect(unreadable.ok || unreadable.error.message).toMatch(/Could not read "16X"/);
    const twoTolerances = parseRating('5% 10%');
    expect(twoTolerances.ok || twoTolerances.error.message).toMatch(/two different tolerances/);
  });

  it('accepts the same figure twice', () => {
    expect(fieldsOf('16V 16 WV').voltage).toBe(16);
  });
});

describe('parseRating limits', () => {
  it('refuses a rating longer than 400 characters quickly', () => {
    const started = Date.now();
    const result = parseRating('1'.repeat(5000));
    expect(result.ok || result.error.message).toMatch(/longer than 400 characters/);
    expect(Date.now() - started).toBeLessThan(50);
  });
});
