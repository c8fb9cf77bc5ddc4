// Unit tests of the bleed-down tool: times, energies, resistor stress, curve points and the caution.
import { describe, expect, it } from 'vitest';
import { BLEED_DOWN_CAUTION, bleedDown, bleedDownCurve, ES1_DC_LIMIT_V, voltageAfter } from '@/lib/bench/bleed-down';

const primary = { capacitanceF: 150e-6, resistanceOhm: 470e3, initialVoltageV: 340 };

describe('bleedDown', () => {
  it('always carries the caution that the capacitor must be measured', () => {
    const result = bleedDown(primary);
    expect(result.ok && result.value.caution).toBe(BLEED_DOWN_CAUTION);
    expect(BLEED_DOWN_CAUTION).toMatch(/Measure the voltage/);
    expect(BLEED_DOWN_CAUTION).toMatch(/never assume it is discharged/);
    expect(BLEED_DOWN_CAUTION).toMatch(/local electrical codes and licensed practice/);
  });

  it('defaults the safe level to 60 V and accepts another', () => {
    const standard = bleedDown(primary);
    expect(standard.ok && standard.value.safeVoltageV).toBe(ES1_DC_LIMIT_V);
    const lower = bleedDown({ ...primary, safeVoltageV: 30 });
    expect(lower.ok && standard.ok && lower.value.timeToSafeS > standard.value.timeToSafeS).toBe(true);
  });

  it('splits the stored energy into what the resistor takes and what is left', () => {
    const result = bleedDown(primary);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.storedEnergyJ).toBeCloseTo(8.67, 10);
    expect(result.value.energyLeftJ).toBeCloseTo(0.27, 10);
    expect(result.value.resistorEnergyJ).toBeCloseTo(8.4, 10);
    expect(result.value.resistorEnergyJ + result.value.energyLeftJ).toBeCloseTo(result.value.storedEnergyJ, 10);
  });

  it('says zero time when the start is already at or below the safe level, and still says to measure', () => {
    const result = bleedDown({ ...primary, initialVoltageV: 48 });
    expect(result).toMatchObject({ ok: true, value: { timeToSafeS: 0, resistorEnergyJ: 0 } });
    expect(result.ok && result.value.notes.join(' ')).toMatch(/measure it all the same/);
  });

  it('refuses bad input', () => {
    expect(bleedDown({ ...primary, resistanceOhm: 0 }).ok).toBe(false);
    expect(bleedDown({ ...primary, capacitanceF: -150e-6 }).ok).toBe(false);
    expect(bleedDown({ ...primary, initialVoltageV: Number.NaN }).ok).toBe(false);
    const result = bleedDown({ ...primary, safeVoltageV: 0 });
    expect(result.ok || result.error.message).toBe('Safe voltage must be above zero.');
  });

  it('refuses finite inputs whose figures would overflow, naming the figure and giving an example', () => {
    // 1e200 F × 1e200 Ω overflows the time constant; 1e200 V squared overflows the energy and the power.
    const longDecay = bleedDown({ ...primary, capacitanceF: 1e200, resistanceOhm: 1e200 });
    expect(longDecay.ok).toBe(false);
    if (!longDecay.ok) {
      expect(longDecay.error.message).toMatch(/^The time constant comes out beyond the numbers this tool can work with/);
      expect(longDecay.error.example).toBe('capacitance 150 µF, bleed resistor 470 kΩ, starting voltage 340 V');
    }
    const hugeVoltage = bleedDown({ ...primary, initialVoltageV: 1e200, safeVoltageV: 1e199 });
    expect(hugeVoltage.ok || hugeVoltage.error.message).toMatch(/^The stored energy comes out beyond/);
    // Only the chart's time axis overflows here: 5 × 1e308 s.
    expect(bleedDown({ ...primary, capacitanceF: 1e154, resistanceOhm: 1e154 }).ok).toBe(false);
  });

  it('refuses a time constant that underflows to zero', () => {
    const result = bleedDown({ ...primary, capacitanceF: 1e-200, resistanceOhm: 1e-200 });
    expect(result.ok || result.error.message).toMatch(/R × C comes out too small/);
  });

  it('still answers extreme inputs whose figures stay finite', () => {
    const result = bleedDown({ ...primary, capacitanceF: 1e100, resistanceOhm: 1e100 });
    expect(
      result.ok &&
        Object.values(result.value)
          .filter((v) => typeof v === 'number')
          .every(Number.isFinite),
    ).toBe(true);
  });
});

describe('voltageAfter', () => {
  it('starts at V0 and decays towards zero', () => {
    expect(voltageAfter(340, 0, 70.5)).toBe(340);
    expect(voltageAfter(340, 1e6, 70.5)).toBeCloseTo(0, 10);
  });
});

describe('bleedDownCurve', () => {
  it('gives evenly spaced falling points to five time constants, with the caution', () => {
    const result = bleedDownCurve(primary, 11);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.caution).toBe(BLEED_DOWN_CAUTION);
    expect(result.value.points).toHaveLength(11);
    expect(result.value.points[0]).toEqual({ timeS: 0, voltageV: 340 });
    expect(result.value.points[10]?.timeS).toBeCloseTo(5 * 70.5, 9);
    const voltages = result.value.points.map((p) => p.voltageV);
    expect(voltages.every((v, i) => i === 0 || v < (voltages[i - 1] ?? Infinity))).toBe(true);
  });

  it('reaches past the safe time when that is later than five time constants', () => {
    const result = bleedDownCurve({ ...primary, initialVoltageV: 40000, safeVoltageV: 1 }, 5);
    expect(result.ok && result.value.points.at(-1)?.voltageV).toBeLessThan(1);
  });

  it('gives only finite points for the longest decay bleedDown accepts', () => {
    // τ = 1e307 s: the chart ends at 5 × τ = 5e307 s, still a number; i × end would overflow before dividing.
    const result = bleedDownCurve({ ...primary, capacitanceF: 1e154, resistanceOhm: 1e153 }, 1000);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.points.every((p) => Number.isFinite(p.timeS) && Number.isFinite(p.voltageV))).toBe(true);
  });

  it('refuses a point count outside 2 to 1000', () => {
    expect(bleedDownCurve(primary, 1).ok).toBe(false);
    expect(bleedDownCurve(primary, 2.5).ok).toBe(false);
  });
});
