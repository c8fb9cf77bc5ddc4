// Reference checks of the ESR reference: the tan δ identity, and typical general-purpose tan δ values recalled from memory (not one named datasheet).
import { describe, expect, it } from 'vitest';
import { maxTanDelta, referenceEsr, tanDeltaFromEsr, typicalTanDeltaTable } from '@/lib/bench/esr';

describe('ESR from the dissipation factor', () => {
  it('holds the typical table values by rated voltage', () => {
    // Typical general-purpose tan δ max at 120 Hz, 20 °C: from memory of series tables, not one named datasheet
    expect(typicalTanDeltaTable.rows.map((r) => [r.ratedVoltageV, r.tanDelta])).toEqual([
      [6.3, 0.28],
      [10, 0.24],
      [16, 0.2],
      [25, 0.16],
      [35, 0.14],
      [50, 0.12],
      [63, 0.1],
      [100, 0.08],
    ]);
  });

  it('gives about 0.265 Ω for 1000 µF 16 V at 120 Hz', () => {
    // tan δ = 2πf·C·ESR (dissipation factor of a series R–C, circuit theory) with tan δ 0.20, the typical 16 V value (from memory)
    const result = referenceEsr({ capacitanceF: 1000e-6, ratedVoltageV: 16 });
    expect(result.ok && Number(result.value.esrOhm.toFixed(3))).toBe(0.265);
  });

  it('satisfies tan δ = 2πfC·ESR', () => {
    // the series R–C identity of circuit theory: tan δ = ωC·R
    const result = referenceEsr({ capacitanceF: 220e-6, ratedVoltageV: 35 });
    expect(result.ok && tanDeltaFromEsr(result.value.esrOhm, 120, 220e-6)).toBeCloseTo(0.14, 12);
  });

  it('adds 0.02 per 1000 µF above 1000 µF', () => {
    // the usual rule under such tables (typical, from memory, not one named datasheet): 3300 µF 16 V → 0.20 + 3 × 0.02
    expect(maxTanDelta(16, 3300e-6)).toEqual({ ok: true, value: 0.26 });
    // 4700 µF 10 V → 0.24 + 4 × 0.02
    expect(maxTanDelta(10, 4700e-6)).toEqual({ ok: true, value: 0.32 });
  });
});
