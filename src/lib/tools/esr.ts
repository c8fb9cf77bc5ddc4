// The ESR tool: a capacitor's reference ESR from its tan δ limit, and a measured ESR read against it.
import { judgeEsr, referenceEsr, type EsrJudgement, type EsrReference } from '@/lib/bench/esr';
import { ok } from '@/lib/values/result';
import { FormReader, type Outcome } from './form-reader';
import { readFrequency, readQuantity } from './numbers';

export const esrFieldNames = ['capacitance', 'ratedVoltage', 'measured', 'frequency'] as const;
export type EsrField = (typeof esrFieldNames)[number];

export type EsrResult = { kind: 'reference'; reference: EsrReference } | { kind: 'judgement'; judgement: EsrJudgement };

export function esrOutcome(fields: Readonly<Record<EsrField, string>>, submitted: boolean): Outcome<EsrField, EsrResult> {
  const form = new FormReader(fields, submitted);
  const capacitanceF = form.required('capacitance', readQuantity('capacitance'));
  const ratedVoltageV = form.required('ratedVoltage', readQuantity('voltage'));
  const measuredOhm = form.optional('measured', readQuantity('resistance'));
  const meterFrequencyHz = form.optional('frequency', readFrequency);
  if (!form.complete || capacitanceF === undefined || ratedVoltageV === undefined) return form.stopped();
  if (measuredOhm === undefined) {
    const reference = referenceEsr({ capacitanceF, ratedVoltageV });
    return form.finish(reference.ok ? ok({ kind: 'reference' as const, reference: reference.value }) : reference);
  }
  const judgement = judgeEsr({ measuredOhm, capacitanceF, ratedVoltageV, ...(meterFrequencyHz ? { meterFrequencyHz } : {}) });
  return form.finish(judgement.ok ? ok({ kind: 'judgement' as const, judgement: judgement.value }) : judgement);
}
