// Bench tool island: can this electrolytic replace the original? Each rule with its reason, the worst one wins.
import '@/lib/schemas/zod-in-browser';
import type { ReactElement } from 'react';
import type { CheckName, SubstituteResult } from '@/lib/bench/substitute';
import { queryFromFields } from '../../lib/tools/form-reader';
import { substituteExample, substituteOutcome, type SubstituteField } from '../../lib/tools/substitute-check';
import { Field } from './ui/Field';
import { NotYet, PrintedInputs } from './ui/ResultStates';
import { StatusMark } from './ui/StatusMark';
import { ToolShell } from './ui/ToolShell';
import { useToolForm } from './ui/use-tool-form';

const PATH = '/tools/substitute-check';

const labels: Record<SubstituteField, string> = {
  value: 'Original value',
  rating: 'Original rating',
  candidateValue: 'Candidate value',
  candidateRating: 'Candidate rating',
  workingVoltage: 'Working voltage',
  roomDiameter: 'Room for the diameter',
  roomHeight: 'Room for the height',
};

const checkNames: Record<CheckName, string> = {
  capacitance: 'Capacitance',
  ratedVoltage: 'Rated voltage',
  headroom: 'Voltage headroom',
  temperature: 'Temperature class',
  lowEsr: 'Low ESR',
  ripple: 'Ripple current',
  diameter: 'Can diameter',
  height: 'Can height',
  leadPitch: 'Lead pitch',
  polarity: 'Polarity',
};

const verdictText: Record<SubstituteResult['verdict'], string> = {
  pass: 'The candidate fits on every check below.',
  warn: 'The candidate may fit: look at the checks marked "Check" before you order.',
  fail: 'The candidate does not fit: see the checks marked "Fail".',
};

export interface SubstituteCheckProps {
  initialFields: Record<SubstituteField, string>;
  submitted: boolean;
}

function Verdict({ result }: { result: SubstituteResult }): ReactElement {
  return (
    <div className="space-y-3">
      <p className="flex flex-wrap items-center gap-2 text-lg font-semibold">
        <StatusMark status={result.verdict} /> {verdictText[result.verdict]}
      </p>
      <table className="tool-table w-full text-sm">
        <caption className="sr-only">Each check with its reason</caption>
        <thead>
          <tr>
            <th scope="col" className="px-2 py-1 text-left">
              Check
            </th>
            <th scope="col" className="px-2 py-1 text-left">
              Result
            </th>
            <th scope="col" className="px-2 py-1 text-left">
              Why
            </th>
          </tr>
        </thead>
        <tbody>
          {result.checks.map((c) => (
            <tr key={c.check} className="border-b border-rule align-top">
              <th scope="row" className="px-2 py-1 text-left font-semibold">
                {checkNames[c.check]}
              </th>
              <td className="px-2 py-1">
                <StatusMark status={c.status} />
              </td>
              <td className="px-2 py-1">{c.reason}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export default function SubstituteCheck({ initialFields, submitted }: SubstituteCheckProps): ReactElement {
  const form = useToolForm(PATH, initialFields, submitted, substituteOutcome);
  const errors = form.outcome.state === 'invalid' ? form.outcome.errors : {};
  const field = (name: SubstituteField) => ({
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
      submitLabel="Check it"
      exampleHref={`${PATH}?${queryFromFields(substituteExample)}`}
      result={
        <>
          <PrintedInputs fields={form.fields} labels={labels} />
          {form.outcome.state === 'done' ? <Verdict result={form.outcome.result} /> : <NotYet outcome={form.outcome} labels={labels} />}
        </>
      }
    >
      <fieldset className="space-y-3">
        <legend className="font-serif text-lg font-semibold text-teal">The original</legend>
        <Field {...field('value')} hint="As on the parts list or the can, e.g. 470u or 470 µF" />
        <Field {...field('rating')} hint="Voltage, class, ESR, size, e.g. 16V 105C low-ESR Ø8x12mm" />
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="font-serif text-lg font-semibold text-teal">The candidate</legend>
        <Field {...field('candidateValue')} hint="The part you mean to fit, e.g. 470u" />
        <Field {...field('candidateRating')} hint="From its datasheet, e.g. 25V 105C low-ESR Ø8x16mm" />
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="font-serif text-lg font-semibold text-teal">The circuit</legend>
        <Field {...field('workingVoltage')} optional hint="DC across the part in use, measured or from the schematic, e.g. 12V" />
        <Field {...field('roomDiameter')} optional hint="Measured room on the board in mm, e.g. 10" />
        <Field {...field('roomHeight')} optional hint="Measured room above the board in mm, e.g. 20" />
      </fieldset>
    </ToolShell>
  );
}
