// Reference checks of the life estimate against the 10-kelvin rule examples of makers' application guides.
import { describe, expect, it } from 'vitest';
import { estimateLife } from '@/lib/bench/life';

function lifeAt(ratedLifeH: number, ratedTemperatureC: number, ambientTemperatureC: number): number | undefined {
  const result = estimateLife({ ratedLifeH, ratedTemperatureC, ambientTemperatureC });
  return result.ok ? result.value.lifeH : undefined;
}

describe('10-kelvin rule', () => {
  it('2000 h at 105 °C run at 85 °C lasts 8000 h', () => {
    expect(lifeAt(2000, 105, 85)).toBe(8000); // capacitor makers' application guides, 10-K rule example
  });

  it('2000 h at 105 °C run at 65 °C lasts 32000 h', () => {
    expect(lifeAt(2000, 105, 65)).toBe(32000); // capacitor makers' application guides, 10-K rule example
  });

  it('1000 h at 85 °C run at 45 °C lasts 16000 h', () => {
    expect(lifeAt(1000, 85, 45)).toBe(16000); // capacitor makers' application guides, 10-K rule example
  });

  it('does not apply above the rated temperature', () => {
    expect(lifeAt(2000, 85, 95)).toBeUndefined(); // application guides: the rule holds only up to the rated temperature
  });

  it('shows why a part beside a hot heatsink fails first', () => {
    // common practice: the same 85 °C part at 70 °C beside a regulator heatsink and at 40 °C elsewhere
    const hot = lifeAt(2000, 85, 70) ?? 0;
    const cool = lifeAt(2000, 85, 40) ?? 0;
    expect(cool / hot).toBeCloseTo(8, 9); // 30 K cooler is 2^3 times the life
  });
});
