// The value decoder: a parts row's value and rating read into its canonical spec, with the field at fault named.
import { z } from 'zod';
import { partKindSchema, partKinds, type PartKind } from '@/lib/schemas/revision';
import { describePart } from '@/lib/values/describe-part';
import { parseValue } from '@/lib/values/parse-value';
import type { PartSpec } from '@/lib/values/part-spec';
import type { InputError } from '@/lib/values/result';
import { FormReader, type Outcome } from './form-reader';

export const decoderFieldNames = ['value', 'rating', 'kind', 'written'] as const;
export type DecoderField = (typeof decoderFieldNames)[number];

/** The kinds offered in the decoder's form; the API takes every part kind. */
export const decoderKinds: ReadonlyArray<{ kind: PartKind | ''; label: string }> = [
  { kind: '', label: 'Any value (give its unit)' },
  { kind: 'capacitor', label: 'Capacitor' },
  { kind: 'resistor', label: 'Resistor' },
  { kind: 'other', label: 'Other part' },
];

/** Where the value was read: a parts list or schematic, or the part itself (where bare digits are codes). */
export const decoderSources: ReadonlyArray<{ written: '' | 'part'; label: string }> = [
  { written: '', label: 'A parts list or schematic' },
  { written: 'part', label: 'The part itself (printed code)' },
];

export const decodeQuerySchema = z.object(
  {
    value: z.string({ error: 'Give the value as text.' }).max(400, 'The value is longer than 400 characters.').default(''),
    rating: z.string({ error: 'Give the rating as text.' }).max(400, 'The rating is longer than 400 characters.').default(''),
    kind: z
      .union([z.literal(''), partKindSchema], { error: `Give one of: ${partKinds.join(', ')}.` })
      .optional()
      .transform((k) => (k === '' ? undefined : k)),
    written: z
      .enum(['', 'list', 'part'], { error: 'Say where the value was written: list (a parts list) or part (printed on the part).' })
      .optional()
      .transform((w) => w === 'part'),
  },
  { error: 'Give the value and, if you have them, the rating and kind, e.g. value 470uF, rating 16V 105C, kind capacitor.' },
);
export type DecodeQuery = z.output<typeof decodeQuerySchema>;

export type DecodeResult = { ok: true; spec: PartSpec } | { ok: false; field: 'value' | 'rating'; error: InputError };

/**
 * Decodes the row and says which field is at fault: the value when it does not read on its own (with the
 * single-value reader's message, which is clearer about a value such as "47uF 16k"), else the rating.
 */
export function decodePart(value: string, rating: string, kind?: PartKind, marking = false): DecodeResult {
  const options = { ...(kind ? { kind } : {}), marking };
  const whole = describePart(value, rating, options);
  if (whole.ok) return { ok: true, spec: whole.value };
  const alone = describePart(value, '', options);
  if (alone.ok) return { ok: false, field: 'rating', error: whole.error };
  const expect = kind === 'capacitor' ? 'capacitance' : kind === 'resistor' ? 'resistance' : undefined;
  const single = parseValue(value, { expect, marking });
  return { ok: false, field: 'value', error: single.ok ? alone.error : single.error };
}

export function decoderOutcome(fields: Readonly<Record<DecoderField, string>>, submitted: boolean): Outcome<DecoderField, PartSpec> {
  const form = new FormReader(fields, submitted);
  const kindText = form.text('kind');
  const kind = partKindSchema.safeParse(kindText);
  if (kindText !== '' && !kind.success)
    form.flag('kind', { message: `"${kindText}" is not a part kind.`, example: 'capacitor or resistor' });
  const written = form.text('written');
  if (written !== '' && written !== 'list' && written !== 'part') {
    form.flag('written', { message: `"${written}" is not a place a value is written.`, example: 'a parts list, or the part itself' });
  }
  const valueText = form.required('value', (text) => ({ ok: true, value: text }));
  if (!form.complete || valueText === undefined) return form.stopped();
  const decoded = decodePart(valueText, form.text('rating'), kind.success ? kind.data : undefined, written === 'part');
  if (decoded.ok) return { state: 'done', result: decoded.spec };
  return { state: 'invalid', errors: { [decoded.field]: decoded.error } };
}
