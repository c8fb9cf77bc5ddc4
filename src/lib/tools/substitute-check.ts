// The substitute tool: original and candidate electrolytics written as on a parts list, checked one rule at a time.
import { checkSubstitute, type CapacitorSpec, type SubstituteResult } from '@/lib/bench/substitute';
import type { ElectricalSpec } from '@/lib/values/part-spec';
import { FormReader, type Outcome } from './form-reader';
import { readNumber, readQuantity } from './numbers';
import { decodePart } from './value-decoder';

export const substituteFieldNames = [
  'value',
  'rating',
  'candidateValue',
  'candidateRating',
  'workingVoltage',
  'roomDiameter',
  'roomHeight',
] as const;
export type SubstituteField = (typeof substituteFieldNames)[number];

export const substituteExample: Record<SubstituteField, string> = {
  value: '470uF',
  rating: '16V 105C low-ESR Ø8x12mm',
  candidateValue: '470uF',
  candidateRating: '25V 105C low-ESR Ø8x16mm',
  workingVoltage: '12V',
  roomDiameter: '',
  roomHeight: '',
};

const RATING_EXAMPLE = '16V 105C low-ESR, or 25V 85C Ø10x16mm';

/** The checks' input fields from a decoded capacitor; only what the rating actually says is set. */
export function capacitorSpecOf(spec: ElectricalSpec): Omit<CapacitorSpec, 'ratedVoltageV'> & { ratedVoltageV?: number } {
  const out: Omit<CapacitorSpec, 'ratedVoltageV'> & { ratedVoltageV?: number } = { capacitanceF: spec.magnitude };
  if (spec.voltage !== undefined) out.ratedVoltageV = spec.voltage;
  if (spec.tolerance) out.tolerance = spec.tolerance;
  if (spec.temperatureC !== undefined) out.temperatureC = spec.temperatureC;
  if (spec.lowEsr !== undefined) out.lowEsr = spec.lowEsr;
  if (spec.rippleCurrentA !== undefined) out.rippleCurrentA = spec.rippleCurrentA;
  if (spec.diameterMm !== undefined) out.diameterMm = spec.diameterMm;
  if (spec.heightMm !== undefined) out.heightMm = spec.heightMm;
  if (spec.leadPitchMm !== undefined) out.leadPitchMm = spec.leadPitchMm;
  if (spec.bipolar !== undefined) out.polarity = spec.bipolar ? 'bipolar' : 'polarised';
  return out;
}

function readCapacitor(
  form: FormReader<SubstituteField>,
  valueField: SubstituteField,
  ratingField: SubstituteField,
): CapacitorSpec | undefined {
  const value = form.required(valueField, (text) => ({ ok: true, value: text }));
  if (value === undefined) return undefined;
  const rating = form.text(ratingField);
  const decoded = decodePart(value, rating, 'capacitor');
  if (!decoded.ok) {
    form.flag(decoded.field === 'value' ? valueField : ratingField, decoded.error);
    return undefined;
  }
  if (decoded.spec.kind !== 'electrical') return undefined;
  const spec = capacitorSpecOf(decoded.spec);
  if (spec.ratedVoltageV === undefined) {
    const error = { message: 'The rating needs the rated voltage.', example: RATING_EXAMPLE };
    if (rating === '') form.absent(ratingField, error);
    else form.flag(ratingField, error);
    return undefined;
  }
  return { ...spec, ratedVoltageV: spec.ratedVoltageV };
}

const readMillimetres = (what: string) => (text: string) => readNumber(text, { what, units: ['mm'], example: '10 mm', max: 200 });

export function substituteOutcome(
  fields: Readonly<Record<SubstituteField, string>>,
  submitted: boolean,
): Outcome<SubstituteField, SubstituteResult> {
  const form = new FormReader(fields, submitted);
  const original = readCapacitor(form, 'value', 'rating');
  const candidate = readCapacitor(form, 'candidateValue', 'candidateRating');
  const workingVoltageV = form.optional('workingVoltage', readQuantity('voltage'));
  const maxDiameterMm = form.optional('roomDiameter', readMillimetres('Room for the diameter'));
  const maxHeightMm = form.optional('roomHeight', readMillimetres('Room for the height'));
  if (!form.complete || original === undefined || candidate === undefined) return form.stopped();
  const space = { ...(maxDiameterMm !== undefined ? { maxDiameterMm } : {}), ...(maxHeightMm !== undefined ? { maxHeightMm } : {}) };
  return form.finish(
    checkSubstitute({
      original,
      candidate,
      ...(workingVoltageV !== undefined ? { workingVoltageV } : {}),
      ...(Object.keys(space).length > 0 ? { space } : {}),
    }),
  );
}
