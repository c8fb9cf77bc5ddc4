import { describe, expect, it } from 'vitest';
import { appendUsedParts, MAX_JOB_PARTS, usedPartsFromList, type UsedPart } from '@/lib/bench/job-parts';
import { describePart } from '@/lib/values/describe-part';

const line = { label: '470 µF 16 V 105 °C', kind: 'capacitor' as const, quantity: 2, refs: ['C512'], sources: ['Fix A'], notes: [] };

describe('usedPartsFromList', () => {
  it('takes the canonical label as the value, which the decoder reads back to the same spec', () => {
    const rows = usedPartsFromList([line]);
    if (!rows.ok) throw new Error(rows.error.message);
    const again = describePart(rows.value[0]!.value, rows.value[0]!.rating, { kind: 'capacitor' });
    expect(again.ok && again.value.label).toBe(line.label);
    expect(rows.value[0]).toMatchObject({ ref: 'C512', quantity: 2, source: 'Fix A' });
  });

  it('keeps designators that do not fit the short ref field in the notes', () => {
    const refs = Array.from({ length: 12 }, (_, i) => `C${500 + i}`);
    const rows = usedPartsFromList([{ ...line, refs, notes: ['low ESR'] }]);
    expect(rows.ok && rows.value[0]).toMatchObject({ ref: '', notes: `Refs: ${refs.join(' ')}; low ESR` });
  });

  it('refuses a line counted more times than a job row holds, with a message', () => {
    const rows = usedPartsFromList([{ ...line, quantity: 1000 }]);
    expect(rows.ok).toBe(false);
    expect(!rows.ok && rows.error.message).toMatch(/at most 999/);
  });
});

describe('appendUsedParts', () => {
  const row: UsedPart = { ref: '', kind: 'resistor', value: '1k', rating: '', quantity: 1, notes: '', source: 'x' };
  it('appends in order and refuses the whole batch past the row limit', () => {
    expect(appendUsedParts([row], [row])).toEqual({ ok: true, value: [row, row] });
    const full = Array.from({ length: MAX_JOB_PARTS }, () => row);
    expect(appendUsedParts(full, [row]).ok).toBe(false);
    expect(appendUsedParts(full.slice(1), [row]).ok).toBe(true);
  });
});
