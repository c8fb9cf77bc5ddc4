// Reference checks of the working-voltage headroom: rated at least 1.25 × working (common practice).
import { describe, expect, it } from 'vitest';
import { checkSubstitute } from '@/lib/bench/substitute';

function headroom(workingVoltageV: number, ratedVoltageV: number): string | undefined {
  const part = { capacitanceF: 100e-6, ratedVoltageV };
  const result = checkSubstitute({ original: part, candidate: part, workingVoltageV });
  return result.ok ? result.value.checks.find((c) => c.check === 'headroom')?.status : undefined;
}

describe('working-voltage headroom', () => {
  it('takes a 16 V part on a 12 V rail', () => {
    expect(headroom(12, 16)).toBe('pass'); // common practice: 12 V rail → 16 V part
  });

  it('takes a 50 V part at 40 V', () => {
    expect(headroom(40, 50)).toBe('pass'); // common practice: 40 V → 50 V
  });

  it('takes a 63 V part at 48 V and warns about a 50 V one', () => {
    expect(headroom(48, 63)).toBe('pass'); // common practice: 48 V → 63 V
    expect(headroom(48, 50)).toBe('warn'); // common practice: 50 V < 1.25 × 48 V = 60 V
  });

  it('fails a part rated below the working voltage', () => {
    expect(headroom(12, 10)).toBe('fail'); // common practice: never below the working voltage
  });
});
