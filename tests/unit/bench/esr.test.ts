// Unit tests of the ESR reference and the reading of a measured ESR against it.
import { describe, expect, it } from 'vitest';
import {
  esrFromTanDelta,
  esrThresholds,
  judgeEsr,
  maxTanDelta,
  referenceEsr,
  tableVoltagesText,
  tanDeltaFromEsr,
  typicalTanDeltaTable,
} from '@/lib/bench/esr';

describe('maxTanDelta', () => {
  it('takes the row of the rated voltage', () => {
    expect(maxTanDelta(16, 470e-6)).toEqual({ ok: true, value: 0.2 });
    expect(maxTanDelta(6.3, 100e-6)).toEqual({ ok: true, value: 0.28 });
  });

  it('adds 0.02 for every started 1000 µF above 1000 µF', () => {
    expect(maxTanDelta(16, 1000e-6)).toEqual({ ok: true, value: 0.2 });
    expect(maxTanDelta(16, 1500e-6)).toEqual({ ok: true, value: 0.22 });
    expect(maxTanDelta(16, 2000e-6)).toEqual({ ok: true, value: 0.22 });
    expect(maxTanDelta(16, 2200e-6)).toEqual({ ok: true, value: 0.24 });
    expect(maxTanDelta(25, 4700e-6)).toEqual({ ok: true, value: 0.24 });
  });

  it('refuses a voltage the table has no row for, naming the voltages it covers and an example', () => {
    const result = maxTanDelta(400, 47e-6);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.error.message).toContain('covers only parts rated 6.3, 10, 16, 25, 35, 50, 63 and 100 V');
      expect(result.error.message).toContain('400 V is not one of them');
      expect(result.error.example).toBe('16V or 25V');
    }
    expect(maxTanDelta(16, 0).ok).toBe(false);
  });

  it('lists the covered voltages from the table itself', () => {
    expect(tableVoltagesText()).toBe('6.3, 10, 16, 25, 35, 50, 63 and 100 V');
  });
});

describe('esrFromTanDelta and tanDeltaFromEsr', () => {
  it('are inverse to each other', () => {
    const esr = esrFromTanDelta(0.14, 120, 220e-6);
    expect(tanDeltaFromEsr(esr, 120, 220e-6)).toBeCloseTo(0.14, 12);
  });
});

describe('referenceEsr', () => {
  it('gives the ESR, the conditions and the table it came from', () => {
    const result = referenceEsr({ capacitanceF: 1000e-6, ratedVoltageV: 16 });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.esrOhm).toBeCloseTo(0.2653, 4);
    expect(result.value).toMatchObject({ tanDelta: 0.2, frequencyHz: 120, temperatureC: 20, table: typicalTanDeltaTable.name });
    expect(result.value.assumptions.length).toBeGreaterThan(0);
  });

  it('refuses bad input', () => {
    expect(referenceEsr({ capacitanceF: -1, ratedVoltageV: 16 }).ok).toBe(false);
    expect(referenceEsr({ capacitanceF: 1e-3, ratedVoltageV: Number.POSITIVE_INFINITY }).ok).toBe(false);
  });
});

describe('judgeEsr', () => {
  const part = { capacitanceF: 1000e-6, ratedVoltageV: 16 };

  it('calls a reading up to the reference good, up to twice it marginal, beyond that replace', () => {
    expect(judgeEsr({ ...part, measuredOhm: 0.1 })).toMatchObject({ ok: true, value: { verdict: 'good' } });
    expect(judgeEsr({ ...part, measuredOhm: 0.265 })).toMatchObject({ ok: true, value: { verdict: 'good' } });
    expect(judgeEsr({ ...part, measuredOhm: 0.4 })).toMatchObject({ ok: true, value: { verdict: 'marginal' } });
    expect(judgeEsr({ ...part, measuredOhm: 0.53 })).toMatchObject({ ok: true, value: { verdict: 'marginal' } });
    expect(judgeEsr({ ...part, measuredOhm: 0.54 })).toMatchObject({ ok: true, value: { verdict: 'replace' } });
    expect(esrThresholds).toEqual({ goodUpTo: 1, marginalUpTo: 2 });
  });

  it('states the ratio and the assumptions, including the meter frequency', () => {
    const result = judgeEsr({ ...part, measuredOhm: 0.4, meterFrequencyHz: 100_000 });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.ratio).toBeCloseTo(1.508, 3);
    expect(result.value.reason).toMatch(/0.4 Ω .* 0.265 Ω/);
    expect(result.value.assumptions.join(' ')).toMatch(/100000 Hz .* lenient ceiling/);
    expect(result.value.assumptions.join(' ')).toMatch(/room temperature/);
  });

  it('refuses a zero or missing measurement', () => {
    expect(judgeEsr({ ...part, measuredOhm: 0 }).ok).toBe(false);
    expect(judgeEsr({ ...part } as never).ok).toBe(false);
  });
});
