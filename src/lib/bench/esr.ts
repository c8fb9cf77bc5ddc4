// ESR reference from the dissipation factor (ESR = tan δ / 2πfC) and reading a measured ESR against it.
import { z } from 'zod';
import { canonicalMagnitude } from '@/lib/values/decimal';
import { ok, type Result } from '@/lib/values/result';
import { esrFromTanDelta, maxTanDelta, typicalTanDeltaTable } from './esr-table';
import { readInput } from './input';
import { figures, positiveNumber } from './numbers';

export { esrFromTanDelta, maxTanDelta, tableVoltagesText, tanDeltaFromEsr, typicalTanDeltaTable } from './esr-table';

export const esrReferenceInputSchema = figures(
  {
    capacitanceF: positiveNumber('Capacitance'),
    ratedVoltageV: positiveNumber('Rated voltage'),
  },
  'capacitance 1000 µF and rated voltage 16 V',
);
export type EsrReferenceInput = z.input<typeof esrReferenceInputSchema>;

export interface EsrReference {
  esrOhm: number;
  tanDelta: number;
  frequencyHz: number;
  temperatureC: number;
  table: string;
  assumptions: string[];
}

const REFERENCE_ASSUMPTIONS = [
  'Maximum ESR of a new general-purpose 85 °C part, from a typical tan δ limit at 120 Hz and 20 °C (values from memory, not one named datasheet; the part’s own datasheet comes first).',
  'Low-ESR and 105 °C series have lower limits; a healthy part of those series reads well below this.',
];

export function referenceEsr(input: EsrReferenceInput): Result<EsrReference> {
  const read = readInput(esrReferenceInputSchema, input, 'capacitance 1000 µF, rated voltage 16 V');
  if (!read.ok) return read;
  const tanDelta = maxTanDelta(read.value.ratedVoltageV, read.value.capacitanceF);
  if (!tanDelta.ok) return tanDelta;
  return ok({
    esrOhm: esrFromTanDelta(tanDelta.value, typicalTanDeltaTable.frequencyHz, read.value.capacitanceF),
    tanDelta: tanDelta.value,
    frequencyHz: typicalTanDeltaTable.frequencyHz,
    temperatureC: typicalTanDeltaTable.temperatureC,
    table: typicalTanDeltaTable.name,
    assumptions: REFERENCE_ASSUMPTIONS,
  });
}

/**
 * Up to the new part's limit is good. Up to twice it is marginal: endurance tests typically pass a part
 * whose tan δ stays within 200 % of the initial limit (from memory of general-purpose series tables),
 * so beyond twice the limit the part is past its own end-of-life criterion.
 */
export const esrThresholds = { goodUpTo: 1, marginalUpTo: 2 } as const;

export type EsrVerdict = 'good' | 'marginal' | 'replace';

export const esrJudgeInputSchema = figures(
  {
    measuredOhm: positiveNumber('Measured ESR'),
    capacitanceF: positiveNumber('Capacitance'),
    ratedVoltageV: positiveNumber('Rated voltage'),
    /** The meter's test frequency; many bench ESR meters test near 100 kHz. */
    meterFrequencyHz: positiveNumber('Meter frequency').max(10_000_000, 'Meter frequency above 10 MHz is not an ESR test.').default(120),
  },
  'measured ESR 0.4 Ω, capacitance 1000 µF and rated voltage 16 V',
);
export type EsrJudgeInput = z.input<typeof esrJudgeInputSchema>;

export interface EsrJudgement {
  verdict: EsrVerdict;
  /** Measured ESR divided by the reference. */
  ratio: number;
  reference: EsrReference;
  thresholds: typeof esrThresholds;
  reason: string;
  assumptions: string[];
}

function assumptionsFor(meterFrequencyHz: number): string[] {
  const common = [
    'Measured out of circuit, or in circuit with nothing in parallel, at room temperature (about 20 °C): ESR rises steeply in the cold and falls when warm.',
  ];
  if (meterFrequencyHz > 1000) {
    return [
      ...common,
      `At ${meterFrequencyHz} Hz a healthy part reads lower than its 120 Hz ESR, so the reference is a lenient ceiling there: above it the part is surely worn, below it the part may still be tired.`,
    ];
  }
  return [
    ...common,
    'The table is at 120 Hz; at 100 Hz the same tan δ gives an ESR about 20 % higher, so read readings near the edge with care.',
  ];
}

export function judgeEsr(input: EsrJudgeInput): Result<EsrJudgement> {
  const read = readInput(esrJudgeInputSchema, input, 'measured ESR 0.4 Ω on 1000 µF 16 V');
  if (!read.ok) return read;
  const { measuredOhm, capacitanceF, ratedVoltageV, meterFrequencyHz } = read.value;
  const reference = referenceEsr({ capacitanceF, ratedVoltageV });
  if (!reference.ok) return reference;
  const ratio = canonicalMagnitude(measuredOhm / reference.value.esrOhm);
  const verdict: EsrVerdict = ratio <= esrThresholds.goodUpTo ? 'good' : ratio <= esrThresholds.marginalUpTo ? 'marginal' : 'replace';
  const referenceText = `${Number(reference.value.esrOhm.toPrecision(3))} Ω`;
  const reasons: Record<EsrVerdict, string> = {
    good: `${measuredOhm} Ω is within the ${referenceText} a new part may have.`,
    marginal: `${measuredOhm} Ω is above the ${referenceText} of a new part but within twice it: worn, not yet past its end-of-life limit.`,
    replace: `${measuredOhm} Ω is more than twice the ${referenceText} of a new part: past the end-of-life limit, replace it.`,
  };
  return ok({
    verdict,
    ratio,
    reference: reference.value,
    thresholds: esrThresholds,
    reason: reasons[verdict],
    assumptions: [...reference.value.assumptions, ...assumptionsFor(meterFrequencyHz)],
  });
}
