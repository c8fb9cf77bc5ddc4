// The tan δ table of typical general-purpose aluminium electrolytics and the tan δ = 2πf·C·ESR identity.
import { canonicalMagnitude } from '@/lib/values/decimal';
import { fail, ok, type Result } from '@/lib/values/result';

/**
 * Typical general-purpose series datasheet table: maximum tan δ at 120 Hz, 20 °C for 85 °C aluminium
 * electrolytics by rated voltage. These are typical published values (from memory of several makers'
 * general-purpose series tables, which agree on them), not one named datasheet.
 */
export const typicalTanDeltaTable = {
  name: 'typical general-purpose series datasheet table',
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
  /** Such tables add 0.02 for every 1000 µF above 1000 µF; a started step is counted (the stricter reading). */
  extraPer1000uF: 0.02,
} as const;

/** tan δ = 2πf·C·ESR, the identity in capacitor makers' technical guides. */
export function esrFromTanDelta(tanDelta: number, frequencyHz: number, capacitanceF: number): number {
  return tanDelta / (2 * Math.PI * frequencyHz * capacitanceF);
}

export function tanDeltaFromEsr(esrOhm: number, frequencyHz: number, capacitanceF: number): number {
  return 2 * Math.PI * frequencyHz * capacitanceF * esrOhm;
}

const TABLE_VOLTAGES = typicalTanDeltaTable.rows.map((r) => `${r.ratedVoltageV} V`).join(', ');

/** The table's maximum tan δ for a rated voltage and capacitance. */
export function maxTanDelta(ratedVoltageV: number, capacitanceF: number): Result<number> {
  const row = typicalTanDeltaTable.rows.find((r) => r.ratedVoltageV === ratedVoltageV);
  if (!row) return fail(`The table has no row for ${ratedVoltageV} V.`, `one of ${TABLE_VOLTAGES}`);
  if (!Number.isFinite(capacitanceF) || capacitanceF <= 0) return fail('Capacitance must be above zero.', '0.001 (1000 µF)');
  const microfarads = canonicalMagnitude(capacitanceF * 1e6);
  const steps = microfarads > 1000 ? Math.ceil((microfarads - 1000) / 1000) : 0;
  return ok(canonicalMagnitude(row.tanDelta + steps * typicalTanDeltaTable.extraPer1000uF));
}
