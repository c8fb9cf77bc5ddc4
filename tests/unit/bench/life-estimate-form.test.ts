// Unit tests of the life tool's form: self-heating given directly, or worked out from ripple current, ESR and thermal resistance.
import { describe, expect, it } from 'vitest';
import { lifeExample, lifeOutcome, type LifeField } from '@/lib/tools/life-estimate';

const fields = (changes: Partial<Record<LifeField, string>>): Record<LifeField, string> => ({ ...lifeExample, ambient: '80', ...changes });

describe('lifeOutcome', () => {
  it('works the self-heating out from ripple current, ESR and thermal resistance', () => {
    // ΔT = I² × ESR × Rth (Joule heating through a thermal resistance): 1 A² × 0.1 Ω × 50 K/W = 5 K,
    // so the part runs at 85 °C and the 10-kelvin rule gives 2000 h × 2^((105 − 85) / 10) = 8000 h.
    const outcome = lifeOutcome(fields({ rippleCurrent: '1 A', esr: '0.1', thermalResistance: '50 K/W' }), true);
    expect(outcome).toMatchObject({ state: 'done', result: { selfHeatingK: 5, coreTemperatureC: 85, lifeH: 8000, fromRipple: true } });
  });

  it('reads milliamps and milliohms: 850 mA through 100 mΩ at 20 K/W adds 1.445 K', () => {
    // 0.85² × 0.1 × 20 = 1.445 K (I² × ESR × Rth)
    const outcome = lifeOutcome(fields({ rippleCurrent: '850mA', esr: '100m', thermalResistance: '20' }), true);
    expect(outcome.state === 'done' && outcome.result.selfHeatingK).toBeCloseTo(1.445, 12);
  });

  it('keeps the direct self-heating when the ripple fields are blank', () => {
    const outcome = lifeOutcome(fields({ selfHeating: '5' }), true);
    expect(outcome).toMatchObject({ state: 'done', result: { selfHeatingK: 5, coreTemperatureC: 85, fromRipple: false } });
  });

  it('asks for the missing ripple fields while typing and marks them once sent', () => {
    expect(lifeOutcome(fields({ rippleCurrent: '1 A' }), false)).toEqual({ state: 'incomplete', missing: ['esr', 'thermalResistance'] });
    const sent = lifeOutcome(fields({ rippleCurrent: '1 A', esr: '0.1' }), true);
    expect(sent.state).toBe('invalid');
    if (sent.state !== 'invalid') return;
    expect(Object.keys(sent.errors)).toEqual(['thermalResistance']);
    expect(sent.errors.thermalResistance).toEqual({
      message: 'Thermal resistance is needed with the other ripple fields to work out the self-heating.',
      example: '50 K/W',
    });
  });

  it('refuses self-heating given both directly and from ripple', () => {
    const outcome = lifeOutcome(fields({ selfHeating: '3', rippleCurrent: '1 A', esr: '0.1', thermalResistance: '50' }), true);
    expect(outcome.state === 'invalid' && outcome.errors.selfHeating?.message).toMatch(/not both/);
  });

  it('refuses a voltage in the ripple current field', () => {
    const outcome = lifeOutcome(fields({ rippleCurrent: '16V', esr: '0.1', thermalResistance: '50' }), true);
    expect(outcome.state === 'invalid' && outcome.errors.rippleCurrent?.message).toMatch(/is a voltage, but a current is expected/);
  });

  it('refuses a ripple self-heating that takes the part past its rating', () => {
    // 2 A² × 0.5 Ω × 50 K/W = 100 K on top of 80 °C
    const outcome = lifeOutcome(fields({ rippleCurrent: '2', esr: '0.5', thermalResistance: '50' }), true);
    expect(outcome.state === 'invalid' && outcome.general?.message).toMatch(/180 °C, above its 105 °C rating/);
  });
});
