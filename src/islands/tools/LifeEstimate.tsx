// Bench tool island: electrolytic life by the 10-kelvin rule, with life against temperature drawn and tabled.
import '@/lib/schemas/zod-in-browser';
import type { ReactElement } from 'react';
import { queryFromFields } from '../../lib/tools/form-reader';
import { celsius, hours, significant, years } from '../../lib/tools/format';
import { lifeExample, lifeOutcome, type LifeField, type LifeOutcomeResult } from '../../lib/tools/life-estimate';
import { HOURS_PER_YEAR } from '@/lib/bench/life';
import { LineChart } from './charts/LineChart';
import { Field } from './ui/Field';
import { NotYet, PrintedInputs } from './ui/ResultStates';
import { Figures, ToolShell } from './ui/ToolShell';
import { useToolForm } from './ui/use-tool-form';

const PATH = '/tools/life-estimate';

const labels: Record<LifeField, string> = {
  ratedLife: 'Rated life',
  ratedTemperature: 'Rated temperature',
  ambient: 'Temperature beside the part',
  selfHeating: 'Self-heating',
  rippleCurrent: 'Ripple current',
  esr: 'ESR',
  thermalResistance: 'Thermal resistance',
};

export interface LifeEstimateProps {
  initialFields: Record<LifeField, string>;
  submitted: boolean;
}

function LifeResult({ result }: { result: LifeOutcomeResult }): ReactElement {
  return (
    <div className="space-y-4">
      <Figures
        rows={[
          { label: 'Expected life', value: `${hours(result.lifeH)} (${years(result.lifeYears)} running day and night)`, strong: true },
          { label: 'Part runs at', value: celsius(result.coreTemperatureC) },
          {
            label: result.fromRipple ? 'Self-heating, I² × ESR × Rth' : 'Self-heating',
            value: `${significant(result.selfHeatingK)} K`,
          },
          { label: 'Factor over the rated life', value: `× ${significant(result.factor)}` },
        ]}
      />
      {result.warnings.length > 0 && (
        <ul className="list-disc pl-5 text-sm text-amber-ink">
          {result.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
      <LineChart
        label={`Life against temperature for a ${hours(result.ratedLifeH)} ${celsius(result.ratedTemperatureC)} part: ${hours(result.lifeH)} at ${celsius(result.coreTemperatureC)}.`}
        points={result.curve.map((p) => ({ x: p.temperatureC, y: p.lifeH }))}
        xTitle="temperature at the part (°C)"
        yTitle="life (hours, log scale)"
        seriesLabel="expected life"
        logY
        marker={{ x: result.coreTemperatureC, y: result.lifeH, label: 'this part' }}
      />
      <table className="tool-table w-full text-sm">
        <caption className="text-left font-semibold">Life against temperature in figures</caption>
        <thead>
          <tr>
            <th scope="col" className="px-2 py-1 text-right">
              Temperature
            </th>
            <th scope="col" className="px-2 py-1 text-right">
              Life
            </th>
            <th scope="col" className="px-2 py-1 text-right">
              Years
            </th>
          </tr>
        </thead>
        <tbody>
          {result.curve.map((p) => (
            <tr key={p.temperatureC}>
              <th scope="row" className="px-2 py-1 value text-right font-normal">
                {celsius(p.temperatureC)}
              </th>
              <td className="px-2 py-1 value text-right">{hours(p.lifeH)}</td>
              <td className="px-2 py-1 value text-right">{years(p.lifeH / HOURS_PER_YEAR)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export default function LifeEstimate({ initialFields, submitted }: LifeEstimateProps): ReactElement {
  const form = useToolForm(PATH, initialFields, submitted, lifeOutcome);
  const errors = form.outcome.state === 'invalid' ? form.outcome.errors : {};
  const field = (name: LifeField) => ({
    name,
    label: labels[name],
    value: form.fields[name],
    onChange: (v: string) => form.setField(name, v),
    error: errors[name],
  });
  return (
    <ToolShell
      path={PATH}
      onSubmit={form.onSubmit}
      exampleHref={`${PATH}?${queryFromFields(lifeExample)}`}
      result={
        <>
          <PrintedInputs fields={form.fields} labels={labels} />
          {form.outcome.state === 'done' ? <LifeResult result={form.outcome.result} /> : <NotYet outcome={form.outcome} labels={labels} />}
        </>
      }
    >
      <Field {...field('ratedLife')} hint="From the datasheet or the sleeve, in hours, e.g. 2000" />
      <Field {...field('ratedTemperature')} hint="The part's class in °C, e.g. 85 or 105" />
      <Field {...field('ambient')} hint="Air beside the part in °C, e.g. 55; beside a regulator's heatsink this is well above room" />
      <Field
        {...field('selfHeating')}
        optional
        hint="Kelvin the ripple current adds inside the can, e.g. 5, if you know it; blank for none, or work it out below"
      />
      <fieldset className="space-y-3">
        <legend className="font-semibold">Or self-heating from the ripple current (all three, optional)</legend>
        <Field {...field('rippleCurrent')} optional hint="RMS ripple current through the part, e.g. 1 A or 850 mA" />
        <Field {...field('esr')} optional hint="The part's ESR at the ripple frequency in ohms, e.g. 0.1 or 100m" />
        <Field
          {...field('thermalResistance')}
          optional
          hint="Can to surrounding air in K/W from the datasheet, e.g. 50 K/W; small cans are higher"
        />
      </fieldset>
    </ToolShell>
  );
}
