// Unit tests of the order list's CSV text: header, quoting and formula-injection defence.
import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { buildOrderList } from '@/lib/bench/order-list';
import { orderListCsv, orderListCsvHeader, safeCell } from '@/lib/bench/order-list-csv';

describe('orderListCsv', () => {
  const built = buildOrderList({
    spares: { count: 1 },
    lines: [
      { source: 'Tray will not close', ref: 'C512', kind: 'capacitor', value: '470uF', rating: '16V 105C', quantity: 2 },
      { source: 'Chews tapes, "sometimes"', ref: 'C3', kind: 'capacitor', value: '47x', rating: '', quantity: 1, notes: '=1+1' },
      { source: 'Chews tapes, "sometimes"', ref: '', kind: 'idler_tyre', value: 'idler tyre 17 x 2 mm', rating: '', quantity: 1 },
    ],
  });

  it('writes a header row and one row per line that a CSV reader reads back', () => {
    expect(built.ok).toBe(true);
    if (!built.ok) return;
    const rows = parse(orderListCsv(built.value)) as string[][];
    expect(rows[0]).toEqual(orderListCsvHeader);
    expect(rows[1]).toEqual(['capacitor', '470 µF 16 V 105 °C', '2', '1', '3', 'C512', 'Tray will not close', '', '']);
    expect(rows[2]).toEqual(['idler tyre', 'idler tyre 17 mm x 2 mm', '1', '1', '2', '', 'Chews tapes, "sometimes"', '', '']);
    expect(rows[3]?.[7]).toBe("'=1+1");
    expect(rows[3]?.[8]).toMatch(/^not decoded: /);
    expect(rows).toHaveLength(4);
  });

  it('writes only the header for an empty list', () => {
    expect(orderListCsv([])).toBe(`${orderListCsvHeader.join(',')}\n`);
  });
});

describe('safeCell', () => {
  it('defuses cells a spreadsheet would run as formulas', () => {
    expect(safeCell('=SUM(A1)')).toBe("'=SUM(A1)");
    expect(safeCell('+1')).toBe("'+1");
    expect(safeCell('-1')).toBe("'-1");
    expect(safeCell('@cmd')).toBe("'@cmd");
    expect(safeCell('470 µF')).toBe('470 µF');
  });
});
