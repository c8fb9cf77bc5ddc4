// Bench tool island: a component value and rating as written, read into one canonical form.
import '@/lib/schemas/zod-in-browser';
import type { ReactElement } from 'react';
import type { PartSpec } from '@/lib/values/part-spec';
import { formatValue } from '@/lib/values/format-value';
import { formatTolerance } from '@/lib/values/tolerance';
import { scaledDecimal } from '@/lib/values/decimal';
import { decoderKinds, decoderOutcome, decoderSources, type DecoderField } from '../../lib/tools/value-decoder';
import { quantityText, significant } from '../../lib/tools/format';
import { Field, SelectField } from './ui/Field';
import { NotYet, PrintedInputs } from './ui/ResultStates';
import { Figures, ToolShell } from './ui/ToolShell';
import { useToolForm } from './ui/use-tool-form';

const PATH = '/tools/value-decoder';

const labels: Record<DecoderField, string> = { value: 'Value', rating: 'Rating', kind: 'Part', written: 'Written on' };

export interface ValueDecoderProps {
  initialFields: Record<DecoderField, string>;
  submitted: boolean;
}

/** The fields a decoded electrical spec carries, one row each, in the label's order. */
function specRows(spec: Extract<PartSpec, { kind: 'electrical' }>): Array<{ label: string; value: string }> {
  const rows = [
    { label: 'Quantity', value: spec.quantity },
    { label: 'Value', value: formatValue({ quantity: spec.quantity, magnitude: spec.magnitude, unit: spec.unit }) },
    { label: 'In base units', value: `${scaledDecimal(spec.magnitude, 0)} ${spec.unit}` },
  ];
  if (spec.tolerance) rows.push({ label: 'Tolerance', value: formatTolerance(spec.tolerance) });
  if (spec.voltage !== undefined) rows.push({ label: 'Rated voltage', value: quantityText(spec.voltage, 'voltage', 6) });
  if (spec.temperatureC !== undefined) rows.push({ label: 'Temperature class', value: `${spec.temperatureC} °C` });
  if (spec.lowEsr) rows.push({ label: 'ESR', value: 'low-ESR' });
  if (spec.bipolar !== undefined) rows.push({ label: 'Polarity', value: spec.bipolar ? 'bipolar' : 'polarised' });
  if (spec.powerW !== undefined) rows.push({ label: 'Power', value: quantityText(spec.powerW, 'power', 6) });
  if (spec.rippleCurrentA !== undefined) rows.push({ label: 'Ripple current', value: quantityText(spec.rippleCurrentA, 'current', 6) });
  if (spec.lifeHours !== undefined) rows.push({ label: 'Rated life', value: `${significant(spec.lifeHours, 6)} h` });
  if (spec.diameterMm !== undefined && spec.heightMm !== undefined)
    rows.push({ label: 'Can', value: `Ø${spec.diameterMm} × ${spec.heightMm} mm` });
  if (spec.leadPitchMm !== undefined) rows.push({ label: 'Lead pitch', value: `${spec.leadPitchMm} mm` });
  if (spec.words.length > 0) rows.push({ label: 'Other words', value: spec.words.join(', ') });
  return rows;
}

function DecodedSpec({ spec }: { spec: PartSpec }): ReactElement {
  if (spec.kind === 'text') {
    return (
      <div className="space-y-2">
        <p className="value text-lg font-semibold text-teal">{spec.label}</p>
        <p className="text-sm text-ink-soft">
          A {spec.partKind.replace(/_/g, ' ')} is matched by its description, written one way so equal parts group on an order list.
        </p>
      </div>
    );
  }
  const preferred = `/tools/preferred-values?${new URLSearchParams({ value: formatValue(spec), quantity: spec.quantity }).toString()}`;
  return (
    <div className="space-y-3">
      <p>
        <span className="text-ink-soft">Canonical form: </span>
        <span className="value text-lg font-semibold text-teal">{spec.label}</span>
      </p>
      <Figures rows={specRows(spec)} />
      {['resistance', 'capacitance', 'inductance'].includes(spec.quantity) && (
        <p className="no-print text-sm">
          <a href={preferred}>Find the nearest preferred value</a>
        </p>
      )}
    </div>
  );
}

export default function ValueDecoder({ initialFields, submitted }: ValueDecoderProps): ReactElement {
  const form = useToolForm(PATH, initialFields, submitted, decoderOutcome);
  const errors = form.outcome.state === 'invalid' ? form.outcome.errors : {};
  return (
    <ToolShell
      path={PATH}
      onSubmit={form.onSubmit}
      submitLabel="Decode"
      exampleHref={`${PATH}?value=4u7&rating=50V%20105C%20%C2%B120%25&kind=capacitor`}
      result={
        <>
          <PrintedInputs fields={form.fields} labels={labels} />
          {form.outcome.state === 'done' ? <DecodedSpec spec={form.outcome.result} /> : <NotYet outcome={form.outcome} labels={labels} />}
        </>
      }
    >
      <SelectField
        name="kind"
        label={labels.kind}
        value={form.fields.kind}
        options={decoderKinds.map((k) => ({ value: k.kind, label: k.label }))}
        onChange={(v) => form.setField('kind', v)}
        error={errors.kind}
      />
      <SelectField
        name="written"
        label={labels.written}
        value={form.fields.written}
        options={decoderSources.map((w) => ({ value: w.written, label: w.label }))}
        onChange={(v) => form.setField('written', v)}
        error={errors.written}
      />
      <Field
        name="value"
        label={labels.value}
        value={form.fields.value}
        onChange={(v) => form.setField('value', v)}
        error={errors.value}
        hint="As written or printed, with a comma or a point, e.g. 4.7 µF, 4,7 µF, 4u7, 104, 2k2, 4R7 or 100uF/16V"
      />
      <Field
        name="rating"
        label={labels.rating}
        value={form.fields.rating}
        onChange={(v) => form.setField('rating', v)}
        error={errors.rating}
        optional
        hint="Voltage, class, tolerance, size, e.g. 16V 105C low-ESR, 0.25W 1% or Ø10x16mm"
      />
    </ToolShell>
  );
}
