// Bench tool island: the ESR a new general-purpose electrolytic may have, and a measured ESR judged against it.
import '@/lib/schemas/zod-in-browser';
import type { ReactElement } from 'react';
import { esrOutcome, type EsrField, type EsrResult } from '../../lib/tools/esr';
import { tableVoltagesText, type EsrReference } from '@/lib/bench/esr';
import { quantityText, significant } from '../../lib/tools/format';
import { Field } from './ui/Field';
import { NotYet, PrintedInputs } from './ui/ResultStates';
import { StatusMark } from './ui/StatusMark';
import { Figures, ToolShell } from './ui/ToolShell';
import { useToolForm } from './ui/use-tool-form';

const PATH = '/tools/esr';

const labels: Record<EsrField, string> = {
  capacitance: 'Capacitance',
  ratedVoltage: 'Rated voltage',
  measured: 'Measured ESR',
  frequency: 'Meter test frequency',
};

export interface EsrCheckProps {
  initialFields: Record<EsrField, string>;
  submitted: boolean;
}

function referenceRows(reference: EsrReference): Array<{ label: string; value: string; strong?: boolean }> {
  return [
    {
      label: `Largest ESR of a new part at ${reference.frequencyHz} Hz`,
      value: quantityText(reference.esrOhm, 'resistance'),
      strong: true,
    },
    { label: 'From tan δ', value: significant(reference.tanDelta) },
    { label: 'Table', value: `${reference.table}, ${reference.frequencyHz} Hz, ${reference.temperatureC} °C` },
  ];
}

function Assumptions({ items }: { items: readonly string[] }): ReactElement {
  return (
    <div>
      <h3 className="text-base">Read it with these in mind</h3>
      <ul className="list-disc pl-5 text-sm">
        {items.map((a) => (
          <li key={a}>{a}</li>
        ))}
      </ul>
    </div>
  );
}

function EsrResultView({ result }: { result: EsrResult }): ReactElement {
  if (result.kind === 'reference') {
    return (
      <div className="space-y-3">
        <Figures rows={referenceRows(result.reference)} />
        <p className="text-sm text-ink-soft">Add the measured ESR to have it judged against this figure.</p>
        <Assumptions items={result.reference.assumptions} />
      </div>
    );
  }
  const { judgement } = result;
  return (
    <div className="space-y-3">
      <p className="flex flex-wrap items-center gap-2 text-lg font-semibold">
        <StatusMark status={judgement.verdict} /> {judgement.reason}
      </p>
      <Figures
        rows={[...referenceRows(judgement.reference), { label: 'Measured ÷ reference', value: `× ${significant(judgement.ratio)}` }]}
      />
      <Assumptions items={judgement.assumptions} />
    </div>
  );
}

export default function EsrCheck({ initialFields, submitted }: EsrCheckProps): ReactElement {
  const form = useToolForm(PATH, initialFields, submitted, esrOutcome);
  const errors = form.outcome.state === 'invalid' ? form.outcome.errors : {};
  const field = (name: EsrField) => ({
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
      exampleHref={`${PATH}?capacitance=1000uF&ratedVoltage=16V&measured=0.4`}
      result={
        <>
          <PrintedInputs fields={form.fields} labels={labels} />
          {form.outcome.state === 'done' ? (
            <EsrResultView result={form.outcome.result} />
          ) : (
            <NotYet outcome={form.outcome} labels={labels} />
          )}
        </>
      }
    >
      <Field {...field('capacitance')} hint="As marked, e.g. 1000uF or 1000 µF" />
      <Field {...field('ratedVoltage')} hint={`The table covers ${tableVoltagesText()}; e.g. 16V`} />
      <Field {...field('measured')} optional hint="The meter's reading in ohms, e.g. 0.4, 0.4 ohm or 400m" />
      <Field {...field('frequency')} optional hint="Blank for 120 Hz; many bench ESR meters test near 100 kHz, e.g. 100 kHz" />
    </ToolShell>
  );
}
