// Bench tool island: the nearest IEC 60063 preferred value (E3 to E192) to a value, with its neighbours.
import '@/lib/schemas/zod-in-browser';
import type { ReactElement } from 'react';
import { inDecade, seriesNames } from '@/lib/bench/preferred-values';
import {
  preferredOutcome,
  preferredQuantities,
  DEFAULT_SERIES,
  type PreferredField,
  type PreferredResult,
} from '../../lib/tools/preferred-values';
import { percent, quantityText } from '../../lib/tools/format';
import { Field, SelectField } from './ui/Field';
import { NotYet, PrintedInputs } from './ui/ResultStates';
import { Figures, ToolShell } from './ui/ToolShell';
import { useToolForm } from './ui/use-tool-form';

const PATH = '/tools/preferred-values';

const labels: Record<PreferredField, string> = { value: 'Value', quantity: 'Quantity', series: 'Series' };

export interface PreferredValuesProps {
  initialFields: Record<PreferredField, string>;
  submitted: boolean;
}

function decadeOf(value: number): number {
  return Math.floor(Math.log10(value) + 1e-9);
}

function PreferredResultView({ result }: { result: PreferredResult }): ReactElement {
  const text = (x: number) => quantityText(x, result.quantity, 4);
  const exact = result.errorPercent === 0;
  const decade = inDecade(result.series, decadeOf(result.nearest));
  return (
    <div className="space-y-4">
      <Figures
        rows={[
          { label: `Nearest ${result.series} value`, value: text(result.nearest), strong: true },
          { label: 'Off by', value: exact ? 'exactly in the series' : percent(result.errorPercent) },
          { label: 'Next below', value: text(result.below) },
          { label: 'Next above', value: text(result.above) },
        ]}
      />
      <div>
        <h3 className="text-base">{result.series} values in this decade</h3>
        <p className="value mt-1 flex flex-wrap gap-x-3 gap-y-1 text-sm">
          {decade.map((v) => (
            <span key={v} className={v === result.nearest ? 'font-semibold text-teal underline' : ''}>
              {text(v)}
            </span>
          ))}
        </p>
      </div>
    </div>
  );
}

export default function PreferredValues({ initialFields, submitted }: PreferredValuesProps): ReactElement {
  const form = useToolForm(PATH, initialFields, submitted, preferredOutcome);
  const errors = form.outcome.state === 'invalid' ? form.outcome.errors : {};
  return (
    <ToolShell
      path={PATH}
      onSubmit={form.onSubmit}
      submitLabel="Find it"
      exampleHref={`${PATH}?value=5k&quantity=resistance&series=E12`}
      result={
        <>
          <PrintedInputs fields={form.fields} labels={labels} />
          {form.outcome.state === 'done' ? (
            <PreferredResultView result={form.outcome.result} />
          ) : (
            <NotYet outcome={form.outcome} labels={labels} />
          )}
        </>
      }
    >
      <SelectField
        name="quantity"
        label={labels.quantity}
        value={form.fields.quantity === '' ? 'resistance' : form.fields.quantity}
        options={preferredQuantities.map((q) => ({ value: q.quantity, label: q.label }))}
        onChange={(v) => form.setField('quantity', v)}
        error={errors.quantity}
      />
      <Field
        name="value"
        label={labels.value}
        value={form.fields.value}
        onChange={(v) => form.setField('value', v)}
        error={errors.value}
        hint="A measured or calculated value, e.g. 5k, 4.3 kΩ, 3300 or 0.33uF"
      />
      <SelectField
        name="series"
        label={labels.series}
        value={form.fields.series === '' ? DEFAULT_SERIES : form.fields.series}
        options={seriesNames.map((s) => ({ value: s, label: s }))}
        onChange={(v) => form.setField('series', v)}
        error={errors.series}
      />
    </ToolShell>
  );
}
