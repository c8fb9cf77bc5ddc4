// Bench tool island: bleed-down time of a stored charge through a resistor, with the decay drawn and tabled.
import '@/lib/schemas/zod-in-browser';
import type { ReactElement } from 'react';
import { bleedExample, bleedOutcome, type BleedField, type BleedOutcomeResult } from '../../lib/tools/bleed-down';
import { queryFromFields } from '../../lib/tools/form-reader';
import { duration, energy, quantityText, significant } from '../../lib/tools/format';
import { LineChart } from './charts/LineChart';
import { Field } from './ui/Field';
import { NotYet, PrintedInputs } from './ui/ResultStates';
import { Figures, ToolShell } from './ui/ToolShell';
import { useToolForm } from './ui/use-tool-form';

const PATH = '/tools/bleed-down';

const labels: Record<BleedField, string> = {
  capacitance: 'Capacitance',
  resistance: 'Bleed resistor',
  voltage: 'Starting voltage',
  safeVoltage: 'Safe voltage',
};

export interface BleedDownProps {
  initialFields: Record<BleedField, string>;
  submitted: boolean;
}

function BleedResult({ result }: { result: BleedOutcomeResult }): ReactElement {
  const safeTime = result.timeToSafeS > 0 ? duration(result.timeToSafeS) : 'already at or below it';
  return (
    <div className="space-y-4">
      <p className="caution-inline rounded border-l-4 border-amber bg-amber-wash p-3 text-amber-ink">{result.caution}</p>
      <Figures
        rows={[
          { label: `Time to ${significant(result.safeVoltageV)} V`, value: safeTime, strong: true },
          { label: 'Time constant RC', value: duration(result.timeConstantS) },
          { label: 'Five time constants (0.7 % left)', value: duration(5 * result.timeConstantS) },
          { label: 'Energy stored at the start', value: energy(result.storedEnergyJ) },
          { label: `Energy left at ${significant(result.safeVoltageV)} V`, value: energy(result.energyLeftJ) },
          { label: 'Energy the resistor takes', value: energy(result.resistorEnergyJ) },
          { label: 'Resistor power at the start', value: quantityText(result.initialResistorPowerW, 'power') },
        ]}
      />
      <ul className="list-disc pl-5 text-sm">
        {result.notes.map((note) => (
          <li key={note}>{note}</li>
        ))}
      </ul>
      <LineChart
        label={`Voltage falling from ${significant(result.initialVoltageV)} V; it reaches ${significant(result.safeVoltageV)} V after ${safeTime}.`}
        points={result.curve.map((p) => ({ x: p.timeS, y: p.voltageV }))}
        xTitle="time (s)"
        yTitle="voltage (V)"
        seriesLabel="voltage across the capacitor"
        level={{ y: result.safeVoltageV, label: `safe level ${significant(result.safeVoltageV)} V` }}
        marker={result.timeToSafeS > 0 ? { x: result.timeToSafeS, y: result.safeVoltageV, label: 'safe level reached' } : undefined}
      />
      <table className="tool-table w-full text-sm">
        <caption className="text-left font-semibold">The decay in figures</caption>
        <thead>
          <tr>
            <th scope="col" className="px-2 py-1 text-left">
              Point
            </th>
            <th scope="col" className="px-2 py-1 text-right">
              Time
            </th>
            <th scope="col" className="px-2 py-1 text-right">
              Voltage
            </th>
          </tr>
        </thead>
        <tbody>
          {result.keyPoints.map((p) => (
            <tr key={p.label}>
              <th scope="row" className="px-2 py-1 text-left font-normal">
                {p.label}
              </th>
              <td className="px-2 py-1 value text-right">{duration(p.timeS)}</td>
              <td className="px-2 py-1 value text-right">{significant(p.voltageV)} V</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export default function BleedDown({ initialFields, submitted }: BleedDownProps): ReactElement {
  const form = useToolForm(PATH, initialFields, submitted, bleedOutcome);
  const errors = form.outcome.state === 'invalid' ? form.outcome.errors : {};
  const field = (name: BleedField) => ({
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
      exampleHref={`${PATH}?${queryFromFields(bleedExample)}`}
      result={
        <>
          <PrintedInputs fields={form.fields} labels={labels} />
          {form.outcome.state === 'done' ? <BleedResult result={form.outcome.result} /> : <NotYet outcome={form.outcome} labels={labels} />}
        </>
      }
    >
      <Field {...field('capacitance')} hint="As marked on the can, e.g. 150uF, 150 µF or 150 mfd" />
      <Field {...field('resistance')} hint="The bleed resistor across it, e.g. 470k or 470 kΩ" />
      <Field {...field('voltage')} hint="Measured or expected across the capacitor; mains peak is about 325–340 V on 230 V, e.g. 340V" />
      <Field {...field('safeVoltage')} optional hint="Blank means 60 V, the ES1 limit for DC in IEC 62368-1; e.g. 42V for a lower limit" />
    </ToolShell>
  );
}
