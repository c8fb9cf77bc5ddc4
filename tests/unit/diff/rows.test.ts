// Table rows: matched by their key first, then by content, then in order; compared cell by cell.
import { describe, expect, it } from 'vitest';
import { diffRows, matchRows } from '@/lib/diff';

type Part = { ref: string; value: string; quantity: number };
const columns = ['ref', 'value', 'quantity'] as const;

describe('diffRows', () => {
  it('matches rows by reference designator even when the order changed', () => {
    const before: Part[] = [
      { ref: 'C512', value: '470uF', quantity: 1 },
      { ref: 'C513', value: '100uF', quantity: 2 },
    ];
    const after: Part[] = [
      { ref: 'C513', value: '100uF', quantity: 2 },
      { ref: 'C512', value: '680uF', quantity: 1 },
    ];
    const rows = diffRows(before, after, columns, (p) => p.ref);
    expect(rows.map((r) => r.status)).toEqual(['same', 'changed']);
    const changed = rows[1]!.cells.filter((c) => c.changed);
    expect(changed).toEqual([{ column: 'value', before: '470uF', after: '680uF', changed: true }]);
  });

  it('reports added and removed rows with empty cells on the missing side', () => {
    const rows = diffRows([{ ref: 'R1', value: '2k2', quantity: 1 }], [{ ref: 'R2', value: '4R7', quantity: 1 }], columns, (p) => p.ref);
    // Rows without a matching key are paired in order: one row replaced by another reads as a change.
    expect(rows.map((r) => r.status)).toEqual(['changed']);
    const onlyAdded = diffRows([], [{ ref: 'R2', value: '4R7', quantity: 1 }], columns, (p) => p.ref);
    expect(onlyAdded[0]!.status).toBe('added');
    expect(onlyAdded[0]!.cells.every((c) => c.before === '')).toBe(true);
    const onlyRemoved = diffRows([{ ref: 'R2', value: '4R7', quantity: 1 }], [], columns, (p) => p.ref);
    expect(onlyRemoved[0]!.status).toBe('removed');
  });

  it('compares quantities as text so 2 and 3 differ', () => {
    const rows = diffRows([{ ref: 'C1', value: '10uF', quantity: 2 }], [{ ref: 'C1', value: '10uF', quantity: 3 }], columns, (p) => p.ref);
    expect(rows[0]!.cells.find((c) => c.column === 'quantity')).toEqual({ column: 'quantity', before: '2', after: '3', changed: true });
  });
});

describe('matchRows', () => {
  it('pairs keyless rows with identical content before pairing the rest in order', () => {
    const belt = { ref: '', value: 'belt 92 x 4 mm', quantity: 1 };
    const tyre = { ref: '', value: 'tyre 14 mm', quantity: 1 };
    const pairs = matchRows([belt, tyre], [tyre, { ...belt, quantity: 2 }], (p) => p.ref);
    expect(pairs).toContainEqual([tyre, tyre]);
    expect(pairs).toContainEqual([belt, { ...belt, quantity: 2 }]);
    expect(pairs).toHaveLength(2);
  });
});
