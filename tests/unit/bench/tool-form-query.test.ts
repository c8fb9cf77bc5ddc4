// Unit tests of how a tool's page reads its address: a link that fills some fields is not a submission.
import { describe, expect, it } from 'vitest';
import { fieldsFromQuery } from '@/lib/tools/form-reader';
import { substituteFieldNames, substituteOutcome } from '@/lib/tools/substitute-check';
import { decoderFieldNames, decoderOutcome } from '@/lib/tools/value-decoder';

/** The address a fix's parts table links to: the row's value and rating only. */
const fromFix = new URLSearchParams({ value: '470uF', rating: '16V 105C' });

describe('fieldsFromQuery', () => {
  it('reads a link that fills some fields as not yet submitted', () => {
    const { fields, submitted } = fieldsFromQuery(substituteFieldNames, fromFix);
    expect(submitted).toBe(false);
    expect(fields).toMatchObject({ value: '470uF', rating: '16V 105C', candidateValue: '' });
  });

  it('reads the form sent without JavaScript, empty fields included, as submitted', () => {
    const sent = new URLSearchParams(substituteFieldNames.map((name) => [name, name === 'value' ? '470uF' : '']));
    expect(fieldsFromQuery(substituteFieldNames, sent).submitted).toBe(true);
  });
});

describe('substitute check opened from a fix', () => {
  it('shows no error before anything is typed, only what is still needed', () => {
    const { fields, submitted } = fieldsFromQuery(substituteFieldNames, fromFix);
    expect(substituteOutcome(fields, submitted)).toEqual({ state: 'incomplete', missing: ['candidateValue'] });
  });

  it('still marks the empty candidate once the reader asks for the result', () => {
    const { fields } = fieldsFromQuery(substituteFieldNames, fromFix);
    const outcome = substituteOutcome(fields, true);
    expect(outcome.state).toBe('invalid');
    if (outcome.state !== 'invalid') return;
    expect(outcome.errors.candidateValue?.message).toMatch(/empty/);
    expect(outcome.errors.candidateValue?.example.length).toBeGreaterThan(0);
  });
});

describe('value decoder form', () => {
  it('reads bare digits as a resistor code when the value is printed on the part', () => {
    const { fields, submitted } = fieldsFromQuery(
      decoderFieldNames,
      new URLSearchParams({ value: '4702', kind: 'resistor', written: 'part' }),
    );
    expect(decoderOutcome(fields, submitted)).toMatchObject({ state: 'done', result: { label: '47 kΩ' } });
    const fromList = fieldsFromQuery(decoderFieldNames, new URLSearchParams({ value: '4702', kind: 'resistor' }));
    expect(decoderOutcome(fromList.fields, fromList.submitted)).toMatchObject({ state: 'done', result: { label: '4.702 kΩ' } });
  });
});
