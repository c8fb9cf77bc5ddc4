// Unit tests of the order list: grouping by canonical spec, quantities, spares, sources and flags.
import { describe, expect, it } from 'vitest';
import { buildOrderList, sparesFor, type OrderLine, type OrderListInput } from '@/lib/bench/order-list';

const trayFix = 'Tray will not close';
const slowStart = 'Slow to start, then shows an error';

function build(input: OrderListInput): OrderLine[] {
  const result = buildOrderList(input);
  if (!result.ok) throw new Error(result.error.message);
  return result.value;
}

describe('buildOrderList', () => {
  const lines: OrderListInput['lines'] = [
    { source: trayFix, ref: 'C512', kind: 'capacitor', value: '470uF', rating: '16V 105C', quantity: 2 },
    { source: slowStart, ref: 'C12', kind: 'capacitor', value: '470 µF', rating: '16 V 105 °C', quantity: 1, notes: 'beside the heatsink' },
    { source: slowStart, ref: 'C3', kind: 'capacitor', value: '100uF', rating: '10V', quantity: 1 },
    { source: slowStart, ref: '', kind: 'belt', value: 'flat belt 92mm x 4mm', rating: '', quantity: 1 },
    { source: trayFix, ref: '', kind: 'belt', value: 'Flat belt 92 x 4 mm', rating: '', quantity: 1 },
    { source: trayFix, ref: 'R7', kind: 'resistor', value: '2k2', rating: '0.25W', quantity: 1 },
  ];

  it('groups equal parts however they were written and sums their quantities', () => {
    const list = build({ lines });
    expect(list.map((l) => [l.label, l.quantity])).toEqual([
      ['100 µF 10 V', 1],
      ['470 µF 16 V 105 °C', 3],
      ['2.2 kΩ 0.25 W', 1],
      ['flat belt 92 mm x 4 mm', 2],
    ]);
  });

  it('keeps which sources and refs each line came from', () => {
    const line = build({ lines }).find((l) => l.label === '470 µF 16 V 105 °C');
    expect(line).toMatchObject({ sources: [trayFix, slowStart], refs: ['C12', 'C512'], notes: ['beside the heatsink'] });
  });

  it('adds spares as a number per line or as a percentage rounded up', () => {
    const counted = build({ lines, spares: { count: 1 } });
    expect(counted.every((l) => l.spares === 1 && l.total === l.quantity + 1)).toBe(true);
    const percent = build({ lines, spares: { percent: 10 } });
    expect(percent.map((l) => l.spares)).toEqual([1, 1, 1, 1]);
    expect(build({ lines }).every((l) => l.spares === 0 && l.total === l.quantity)).toBe(true);
  });

  it('keeps undecodable rows as their own flagged lines, never dropped or merged', () => {
    const list = build({
      lines: [
        ...lines,
        { source: trayFix, ref: 'C9', kind: 'capacitor', value: '47x', rating: '', quantity: 2 },
        { source: slowStart, ref: 'C10', kind: 'capacitor', value: '47x', rating: '', quantity: 1 },
      ],
    });
    const flagged = list.filter((l) => l.undecodable);
    expect(flagged).toHaveLength(2);
    expect(flagged[0]).toMatchObject({ label: '47x', quantity: 2, refs: ['C9'], sources: [trayFix] });
    expect(flagged[0]?.problem).toMatch(/"x"/);
    expect(list.slice(-2)).toEqual(flagged);
    const total = (items: OrderListInput['lines']): number => items.reduce((sum, l) => sum + l.quantity, 0);
    expect(list.reduce((sum, l) => sum + l.quantity, 0)).toBe(total(lines) + 3);
  });

  it('returns an empty list for no rows', () => {
    expect(build({ lines: [] })).toEqual([]);
  });

  it('refuses rows without a source or with a bad quantity', () => {
    const noSource = buildOrderList({ lines: [{ source: '', ref: 'C1', kind: 'capacitor', value: '10uF', rating: '', quantity: 1 }] });
    expect(noSource.ok || noSource.error.message).toMatch(/lines\.0\.source: Say where the part came from/);
    const zero = buildOrderList({ lines: [{ source: trayFix, ref: 'C1', kind: 'capacitor', value: '10uF', rating: '', quantity: 0 }] });
    expect(zero.ok).toBe(false);
    expect(buildOrderList({ lines: [], spares: { percent: -5 } }).ok).toBe(false);
  });
});

describe('sparesFor', () => {
  it('rounds a percentage up and gives none without spares', () => {
    expect(sparesFor(3, { percent: 10 })).toBe(1);
    expect(sparesFor(10, { percent: 10 })).toBe(1);
    expect(sparesFor(11, { percent: 10 })).toBe(2);
    expect(sparesFor(20, { percent: 15 })).toBe(3);
    expect(sparesFor(5, { percent: 0 })).toBe(0);
    expect(sparesFor(5, { count: 2 })).toBe(2);
    expect(sparesFor(5, undefined)).toBe(0);
  });
});
