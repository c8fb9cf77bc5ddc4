// The order list as kept in the browser and the database: merging by canonical spec, edits, the ?add= payload, CSV.
// Pure code; it sits with the integration tests because the other order-list tests read its results through the server.
import { describe, expect, it } from 'vitest';
import {
  addRows,
  applySpares,
  mergeLists,
  readStoredLines,
  removeLine,
  setQuantity,
  storedListCsv,
  type StoredLine,
} from '@/lib/tools/order-list';

const row = (ref: string, value: string, rating: string, source = 'Dead after a storm (r2)', quantity = 1) => ({
  source,
  ref,
  kind: 'capacitor' as const,
  value,
  rating,
  quantity,
  notes: '',
});

function added(rows: ReturnType<typeof row>[], existing: StoredLine[] = []): StoredLine[] {
  const result = addRows(existing, rows);
  if (!result.ok) throw new Error(result.error.message);
  return result.value;
}

describe('addRows', () => {
  it('merges rows of the same part, written differently, from two fixes into one line', () => {
    const first = added([row('C512', '470uF', '16V 105C')]);
    const both = added([row('C1411', '470 µF', '16 V 105 °C', 'Slow to start (r1)', 2)], first);
    expect(both).toHaveLength(1);
    expect(both[0]).toEqual(
      expect.objectContaining({
        label: '470 µF 16 V 105 °C',
        quantity: 3,
        refs: ['C512', 'C1411'],
        sources: ['Dead after a storm (r2)', 'Slow to start (r1)'],
      }),
    );
  });

  it('keeps an unreadable row as its own flagged line, and the same unreadable row twice as one', () => {
    const lines = added([row('C9', '47x', ''), row('C9', '47x', '', 'Another fix (r1)')]);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toEqual(expect.objectContaining({ undecodable: true, quantity: 2 }));
    expect(lines[0]?.problem).toContain('not a unit or prefix');
  });

  it('refuses a row the schema does not take, with an example', () => {
    const result = addRows([], [{ ...row('C1', '10uF', '16V'), quantity: 0 }]);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error.example).toContain('Tray will not close');
  });
});

describe('edits', () => {
  const lines = added([row('C1', '10uF', '16V', 'A', 3), row('C2', '220uF', '25V', 'A', 1)]);

  it('sets a quantity, ignores a quantity below 1, removes a line', () => {
    const key = lines[0]!.key;
    expect(setQuantity(lines, key, 7)[0]?.quantity).toBe(7);
    expect(setQuantity(lines, key, 0)[0]?.quantity).toBe(3);
    expect(removeLine(lines, key).map((l) => l.key)).toEqual([lines[1]!.key]);
  });

  it('applies spares to every line: a count, or a percentage rounded up', () => {
    expect(applySpares(lines, { count: 1 }).map((l) => l.spares)).toEqual([1, 1]);
    // 10 % of 3 is 0.3, rounded up to 1; of 1 it is 0.1, also 1.
    expect(applySpares(lines, { percent: 10 }).map((l) => l.spares)).toEqual([1, 1]);
    expect(applySpares(lines, undefined).map((l) => l.spares)).toEqual([0, 0]);
  });

  it('writes the CSV with quantity, spares and the total to order', () => {
    const csv = storedListCsv(applySpares(lines, { count: 2 }));
    expect(csv.split('\n')[1]).toBe('capacitor,10 µF 16 V,3,2,5,C1,A,,');
  });
});

describe('mergeLists', () => {
  it('adds the second list into the first by key and keeps the first list order', () => {
    const a = added([row('C1', '10uF', '16V'), row('C2', '22uF', '16V')]);
    const b = added([row('C7', '22 µF', '16 V'), row('C8', '100uF', '10V')]);
    const merged = mergeLists(a, b);
    expect(merged.map((l) => [l.label, l.quantity])).toEqual([
      ['10 µF 16 V', 1],
      ['22 µF 16 V', 2],
      ['100 µF 10 V', 1],
    ]);
  });
});

describe('readStoredLines', () => {
  it('keeps the good lines of a damaged stored list and drops the rest', () => {
    const good = added([row('C1', '10uF', '16V')])[0];
    expect(readStoredLines([good, { key: 'x' }, null, 'text', { ...good }])).toEqual([good]);
    expect(readStoredLines('not a list')).toEqual([]);
  });
});
