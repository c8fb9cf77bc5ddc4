// Typical tan δ values of general-purpose aluminium electrolytics (from memory) and the tan δ = 2πf·C·ESR identity.
import { canonicalMagnitude } from '@/lib/values/decimal';
import { fail, ok, type Result } from '@/lib/values/result';

/**
 * Maximum tan δ at 120 Hz, 20 °C for general-purpose 85 °C aluminium electrolytics by rated voltage.
 * These are typical values recalled from memory of general-purpose series tables, not read from one named
 * datasheet; a part's own datasheet, where there is one, takes precedence.
 */
export const typicalTanDeltaTable = {
  name: 'typical general-purpose values, from memory (not one named datasheet)',
  frequencyHz: 120,
  temperatureC: 20,
  rows: [
    { ratedVoltageV: 6.3, tanDelta: 0.28 },
    { ratedVoltageV: 10, tanDelta: 0.24 },
    { ratedVoltageV: 16, tanDelta: 0.2 },
    { ratedVoltageV: 25, tanDelta: 0.16 },
    { ratedVoltageV: 35, tanDelta: 0.14 },
    { ratedVoltageV: 50, tanDelta: 0.12 },
    { ratedVoltageV: 63, tanDelta: 0.1 },
    { ratedVoltageV: 100, tanDelta: 0.08 },
  ],
  /** Typically 0.02 more for every 1000 µF above 1000 µF (from memory); a started step is counted (the stricter reading). */
  extraPer1000uF: 0.02,
} as const;

/** tan δ = 2πf·C·ESR: the dissipation factor of a capacitance in series with a resistance (circuit theory). */
export function esrFromTanDelta(tanDelta: number, frequencyHz: number, capacitanceF: number): number {
  return tanDelta / (2 * Math.PI * frequencyHz * capacitanceF);
}

export function tanDeltaFromEsr(esrOhm: number, frequencyHz: number, capacitanceF: number): number {
  return 2 * Math.PI * frequencyHz * capacitanceF * esrOhm;
}

/** The rated voltages the table covers, in words: "6.3, 10, 16, 25, 35, 50, 63 and 100 V". */
export function tableVoltagesText(): string {
  const voltages = typicalTanDeltaTable.rows.map((r) => String(r.ratedVoltageV));
  return `${voltages.slice(0, -1).join(', ')} and ${voltages.at(-1) ?? ''} V`;
}

/** The table's maximum tan δ for a rated voltage and capacitance. */
export function maxTanDelta(ratedVoltageV: number, capacitanceF: number): Result<number> {
  const row = typicalTanDeltaTable.rows.find((r) => r.ratedVoltageV === ratedVoltageV);
  if (!row) {
    return fail(
      `The reference table covers only parts rated ${tableVoltagesText()}; ${ratedVoltageV} V is not one of them, so this tool has no reference figure for that part.`,
      '16V or 25V',
    );
  }
  if (!Number.isFinite(capacitanceF) || capacitanceF <= 0) return fail('Capacitance must be above zero.', '0.001 (1000 µF)');
  const microfarads = canonicalMagnitude(capacitanceF * 1e6);
  const steps = microfarads > 1000 ? Math.ceil((microfarads - 1000) / 1000) : 0;
  return ok(canonicalMagnitude(row.tanDelta + steps * typicalTanDeltaTable.extraPer1000uF));
}
