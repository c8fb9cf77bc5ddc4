// Unit tests of the electrolytic substitute check: each check, its reason and the overall verdict.
import { describe, expect, it } from 'vitest';
import { checkSubstitute, worstStatus, type SubstituteInput, type SubstituteResult } from '@/lib/bench/substitute';

const original = { capacitanceF: 470e-6, ratedVoltageV: 16, temperatureC: 85 };

function run(input: SubstituteInput): SubstituteResult {
  const result = checkSubstitute(input);
  if (!result.ok) throw new Error(result.error.message);
  return result.value;
}

function statusOf(result: SubstituteResult, check: string): string | undefined {
  return result.checks.find((c) => c.check === check)?.status;
}

describe('checkSubstitute', () => {
  it('passes an identical part', () => {
    const result = run({ original, candidate: original });
    expect(result.verdict).toBe('pass');
    expect(result.checks.map((c) => c.check)).toEqual(['capacitance', 'ratedVoltage', 'temperature', 'polarity']);
  });

  it('passes a higher voltage and temperature class', () => {
    expect(run({ original, candidate: { ...original, ratedVoltageV: 25, temperatureC: 105 } }).verdict).toBe('pass');
  });

  it('judges capacitance against the original tolerance, ±20 % when unknown', () => {
    const within = run({ original, candidate: { ...original, capacitanceF: 560e-6 } });
    expect(statusOf(within, 'capacitance')).toBe('pass');
    expect(within.checks[0]?.reason).toMatch(/376 µF to 564 µF, taking the usual ±20 %/);
    expect(statusOf(run({ original, candidate: { ...original, capacitanceF: 330e-6 } }), 'capacitance')).toBe('fail');
    expect(statusOf(run({ original, candidate: { ...original, capacitanceF: 1000e-6 } }), 'capacitance')).toBe('warn');
    const tight = { ...original, tolerance: { minusPercent: 10, plusPercent: 10 } };
    expect(statusOf(run({ original: tight, candidate: { ...original, capacitanceF: 420e-6 } }), 'capacitance')).toBe('fail');
    expect(statusOf(run({ original, candidate: { ...original, capacitanceF: 376e-6 } }), 'capacitance')).toBe('pass');
  });

  it('fails a lower rated voltage', () => {
    const result = run({ original, candidate: { ...original, ratedVoltageV: 10 } });
    expect(statusOf(result, 'ratedVoltage')).toBe('fail');
    expect(result.verdict).toBe('fail');
    expect(result.checks.find((c) => c.check === 'ratedVoltage')?.reason).toBe("Rated 10 V is lower than the original's 16 V.");
  });

  it('checks headroom over the working voltage when it is known', () => {
    expect(statusOf(run({ original, candidate: original, workingVoltageV: 12 }), 'headroom')).toBe('pass');
    expect(statusOf(run({ original, candidate: original, workingVoltageV: 14 }), 'headroom')).toBe('warn');
    expect(statusOf(run({ original, candidate: original, workingVoltageV: 17 }), 'headroom')).toBe('fail');
    expect(run({ original, candidate: original }).checks.some((c) => c.check === 'headroom')).toBe(false);
  });

  it('fails a lower temperature class and warns when the candidate class is unknown', () => {
    const hot = { ...original, temperatureC: 105 };
    expect(statusOf(run({ original: hot, candidate: original }), 'temperature')).toBe('fail');
    expect(statusOf(run({ original: hot, candidate: { capacitanceF: 470e-6, ratedVoltageV: 16 } }), 'temperature')).toBe('warn');
  });

  it('keeps low-ESR where the original was', () => {
    const lowEsr = { ...original, lowEsr: true };
    expect(statusOf(run({ original: lowEsr, candidate: lowEsr }), 'lowEsr')).toBe('pass');
    expect(statusOf(run({ original: lowEsr, candidate: { ...original, lowEsr: false } }), 'lowEsr')).toBe('fail');
    expect(statusOf(run({ original: lowEsr, candidate: original }), 'lowEsr')).toBe('warn');
    expect(statusOf(run({ original, candidate: lowEsr }), 'lowEsr')).toBe('pass');
  });

  it('fails a lower ripple rating', () => {
    const rated = { ...original, rippleCurrentA: 0.8 };
    expect(statusOf(run({ original: rated, candidate: { ...original, rippleCurrentA: 0.5 } }), 'ripple')).toBe('fail');
    expect(statusOf(run({ original: rated, candidate: { ...original, rippleCurrentA: 1.1 } }), 'ripple')).toBe('pass');
    expect(statusOf(run({ original: rated, candidate: original }), 'ripple')).toBe('warn');
  });

  it('checks can size against the original or against measured room', () => {
    const sized = { ...original, diameterMm: 8, heightMm: 12, leadPitchMm: 3.5 };
    expect(run({ original: sized, candidate: sized }).verdict).toBe('pass');
    expect(statusOf(run({ original: sized, candidate: { ...sized, diameterMm: 10 } }), 'diameter')).toBe('warn');
    expect(statusOf(run({ original: sized, candidate: { ...sized, diameterMm: 10 }, space: { maxDiameterMm: 9 } }), 'diameter')).toBe(
      'fail',
    );
    expect(statusOf(run({ original: sized, candidate: { ...sized, heightMm: 16 }, space: { maxHeightMm: 20 } }), 'height')).toBe('pass');
    expect(statusOf(run({ original: sized, candidate: { ...sized, leadPitchMm: 5 } }), 'leadPitch')).toBe('warn');
    expect(statusOf(run({ original: sized, candidate: original }), 'diameter')).toBe('warn');
  });

  it('lets a bipolar part replace a polarised one but not the other way round', () => {
    const bipolar = { ...original, polarity: 'bipolar' as const };
    expect(statusOf(run({ original, candidate: bipolar }), 'polarity')).toBe('pass');
    expect(statusOf(run({ original: bipolar, candidate: original }), 'polarity')).toBe('fail');
  });

  it('takes the worst check as the verdict', () => {
    const result = run({ original: { ...original, lowEsr: true }, candidate: { ...original, ratedVoltageV: 25 } });
    expect(result.verdict).toBe('warn');
    expect(worstStatus(['pass', 'warn', 'fail', 'pass'])).toBe('fail');
    expect(worstStatus([])).toBe('pass');
  });

  it('refuses bad input with a message naming the field', () => {
    const negative = checkSubstitute({ original: { ...original, capacitanceF: -1 }, candidate: original });
    expect(negative.ok || negative.error.message).toBe('original.capacitanceF: Capacitance must be above zero.');
    const missing = checkSubstitute({ original, candidate: { capacitanceF: 1e-4 } } as never);
    expect(missing.ok).toBe(false);
    const notANumber = checkSubstitute({ original, candidate: { ...original, ratedVoltageV: Number.NaN } });
    expect(notANumber.ok || notANumber.error.message).toMatch(/Rated voltage must be a number/);
  });
});
