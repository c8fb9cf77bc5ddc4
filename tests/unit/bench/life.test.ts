// Unit tests of the 10-kelvin life estimate, its self-heating inputs, warnings and chart points.
import { describe, expect, it } from 'vitest';
import { estimateLife, lifeCurve, rippleSelfHeatingK, LONGEST_CREDIBLE_HOURS } from '@/lib/bench/life';

describe('estimateLife', () => {
  it('doubles life for every 10 K below the rating', () => {
    expect(estimateLife({ ratedLifeH: 2000, ratedTemperatureC: 105, ambientTemperatureC: 95 })).toMatchObject({
      ok: true,
      value: { lifeH: 4000, factor: 2, coreTemperatureC: 95, selfHeatingK: 0 },
    });
    expect(estimateLife({ ratedLifeH: 2000, ratedTemperatureC: 105, ambientTemperatureC: 105 })).toMatchObject({
      ok: true,
      value: { lifeH: 2000, factor: 1 },
    });
  });

  it('adds self-heating given directly', () => {
    expect(estimateLife({ ratedLifeH: 2000, ratedTemperatureC: 105, ambientTemperatureC: 75, selfHeatingK: 10 })).toMatchObject({
      ok: true,
      value: { coreTemperatureC: 85, lifeH: 8000 },
    });
  });

  it('computes self-heating from ripple current, ESR and thermal resistance', () => {
    expect(rippleSelfHeatingK(1, 0.1, 50)).toBeCloseTo(5, 12);
    const result = estimateLife({
      ratedLifeH: 2000,
      ratedTemperatureC: 105,
      ambientTemperatureC: 80,
      ripple: { currentA: 1, esrOhm: 0.1, thermalResistanceKPerW: 50 },
    });
    expect(result).toMatchObject({ ok: true, value: { selfHeatingK: 5, coreTemperatureC: 85, lifeH: 8000 } });
  });

  it('refuses a part run above its rated temperature', () => {
    const result = estimateLife({ ratedLifeH: 2000, ratedTemperatureC: 85, ambientTemperatureC: 80, selfHeatingK: 10 });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error.message).toMatch(/90 °C, above its 85 °C rating/);
  });

  it('warns outside 70–90 °C and beyond about 15 years', () => {
    const cool = estimateLife({ ratedLifeH: 2000, ratedTemperatureC: 105, ambientTemperatureC: 40 });
    expect(cool.ok && cool.value.warnings.join(' ')).toMatch(/70–90 °C/);
    expect(cool.ok && cool.value.lifeH).toBeGreaterThan(LONGEST_CREDIBLE_HOURS);
    expect(cool.ok && cool.value.warnings.join(' ')).toMatch(/15 years/);
    const inBand = estimateLife({ ratedLifeH: 2000, ratedTemperatureC: 105, ambientTemperatureC: 80 });
    expect(inBand.ok && inBand.value.warnings).toEqual([]);
  });

  it('refuses bad input', () => {
    expect(estimateLife({ ratedLifeH: 0, ratedTemperatureC: 105, ambientTemperatureC: 80 }).ok).toBe(false);
    expect(estimateLife({ ratedLifeH: 2000, ratedTemperatureC: 105, ambientTemperatureC: Number.NaN }).ok).toBe(false);
    expect(estimateLife({ ratedLifeH: 2000, ratedTemperatureC: 105, ambientTemperatureC: 300 }).ok).toBe(false);
    const both = estimateLife({
      ratedLifeH: 2000,
      ratedTemperatureC: 105,
      ambientTemperatureC: 70,
      selfHeatingK: 3,
      ripple: { currentA: 1, esrOhm: 0.1, thermalResistanceKPerW: 50 },
    });
    expect(both.ok || both.error.message).toMatch(/not both/);
  });

  it('refuses a life that overflows to Infinity, naming the figure and giving an example', () => {
    // 1e308 h × 2^((200 − (−55)) / 10) is beyond the largest double.
    const result = estimateLife({ ratedLifeH: 1e308, ratedTemperatureC: 200, ambientTemperatureC: -55 });
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.error.message).toMatch(/^The expected life comes out beyond the numbers this tool can work with/);
      expect(result.error.example).toBe('rated life 2000 h at 105 °C, 85 °C beside the part');
    }
  });

  it('refuses ripple self-heating that overflows instead of calling the part Infinity °C hot', () => {
    const result = estimateLife({
      ratedLifeH: 2000,
      ratedTemperatureC: 105,
      ambientTemperatureC: 20,
      ripple: { currentA: 1e200, esrOhm: 1, thermalResistanceKPerW: 1 },
    });
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.error.message).toMatch(/^The self-heating comes out beyond/);
      expect(result.error.message).not.toContain('Infinity');
      expect(result.error.example).toBe('ripple current 1 A through 0.1 Ω at 50 K/W (5 K)');
    }
  });
});

describe('lifeCurve', () => {
  it('gives points from the lowest temperature up to the rating and stops there', () => {
    const result = lifeCurve({ ratedLifeH: 1000, ratedTemperatureC: 85, fromC: 45, stepC: 10 });
    expect(result).toEqual({
      ok: true,
      value: [
        { temperatureC: 45, lifeH: 16000 },
        { temperatureC: 55, lifeH: 8000 },
        { temperatureC: 65, lifeH: 4000 },
        { temperatureC: 75, lifeH: 2000 },
        { temperatureC: 85, lifeH: 1000 },
      ],
    });
  });

  it('ends exactly at the rating when the step does not divide the range', () => {
    const result = lifeCurve({ ratedLifeH: 2000, ratedTemperatureC: 105, fromC: 40, stepC: 30 });
    expect(result.ok && result.value.map((p) => p.temperatureC)).toEqual([40, 70, 100, 105]);
  });

  it('refuses a curve whose coolest point overflows', () => {
    expect(lifeCurve({ ratedLifeH: 1e308, ratedTemperatureC: 200, fromC: -55 }).ok).toBe(false);
  });

  it('refuses a start at or above the rating', () => {
    expect(lifeCurve({ ratedLifeH: 2000, ratedTemperatureC: 105, fromC: 105 }).ok).toBe(false);
    expect(lifeCurve({ ratedLifeH: 2000, ratedTemperatureC: 105, stepC: 0 }).ok).toBe(false);
  });
});
