// Reference checks of the bleed-down tool against the RC discharge identity and IEC 62368-1's ES1 limit.
import { describe, expect, it } from 'vitest';
import { bleedDown, ES1_DC_LIMIT_V, voltageAfter } from '@/lib/bench/bleed-down';

describe('RC discharge', () => {
  it('falls to 36.8 % after one time constant and 0.67 % after five', () => {
    // V(t) = V0·e^(−t/RC), any circuits textbook: e^−1 = 0.3679, e^−5 = 0.006738
    expect(Number((voltageAfter(100, 1, 1) / 100).toFixed(3))).toBe(0.368);
    expect(Number(((voltageAfter(100, 5, 1) / 100) * 100).toFixed(2))).toBe(0.67);
  });

  it('uses 60 V DC as the default safe level', () => {
    expect(ES1_DC_LIMIT_V).toBe(60); // IEC 62368-1, ES1 limit for DC voltage
  });

  it('takes about 122 s for 150 µF through 470 kΩ from 340 V to 60 V, 0.246 W at the start', () => {
    // t = RC·ln(V0/Vsafe) = 70.5 s × ln(340/60) (RC discharge identity); P = V²/R = 340²/470 000
    const result = bleedDown({ capacitanceF: 150e-6, resistanceOhm: 470e3, initialVoltageV: 340 });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(Math.round(result.value.timeToSafeS)).toBe(122);
    expect(Number(result.value.initialResistorPowerW.toFixed(3))).toBe(0.246);
    expect(result.value.timeConstantS).toBe(70.5);
  });

  it('stores ½CV²', () => {
    // stored energy of a capacitor, any circuits textbook: ½ × 150 µF × (340 V)² = 8.67 J
    const result = bleedDown({ capacitanceF: 150e-6, resistanceOhm: 470e3, initialVoltageV: 340 });
    expect(result.ok && result.value.storedEnergyJ).toBe(8.67);
  });
});
