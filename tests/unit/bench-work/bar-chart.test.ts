// Unit tests of the bar chart geometry: tick steps against d3-array, bar lengths, label shortening.
import { describe, expect, it } from 'vitest';
// d3-array comes with @observablehq/plot; its ticks are the general-purpose reference for axis steps.
import { tickStep, ticks } from 'd3-array';
import { countTickStep, countTicks, layoutBarChart, shortenLabel } from '@/lib/stats/bar-chart';

describe('countTickStep', () => {
  it('agrees with d3-array tickStep wherever that step is a whole number', () => {
    for (const max of [5, 7, 10, 12, 19, 23, 48, 50, 99, 137, 1000, 4321]) {
      for (const target of [3, 5, 8]) {
        const reference = tickStep(0, max, target);
        if (reference >= 1) expect(countTickStep(max, target)).toBe(reference);
      }
    }
  });

  it('never steps below 1, because counts are whole', () => {
    expect(countTickStep(1, 5)).toBe(1);
    expect(countTickStep(3, 5)).toBe(1);
    expect(countTickStep(0, 5)).toBe(1);
    expect(countTickStep(Number.NaN, 5)).toBe(1);
  });
});

describe('countTicks', () => {
  it('matches d3-array ticks when the maximum falls on a tick', () => {
    expect(countTicks(50, 5)).toEqual(ticks(0, 50, 5));
    expect(countTicks(20, 5)).toEqual(ticks(0, 20, 5));
  });

  it('runs one tick past a maximum that falls between ticks, so the longest bar fits', () => {
    // d3-array gives 0, 10, 20, 30, 40 for 0..43; the axis must reach 50.
    expect(ticks(0, 43, 5)).toEqual([0, 10, 20, 30, 40]);
    expect(countTicks(43, 5)).toEqual([0, 10, 20, 30, 40, 50]);
  });

  it('gives 0 and 1 for an empty chart', () => {
    expect(countTicks(0, 5)).toEqual([0, 1]);
  });
});

describe('layoutBarChart', () => {
  it('scales bars to the axis and keeps their order', () => {
    const chart = layoutBarChart(
      [
        { label: 'Fixed', value: 8 },
        { label: 'Not fixed', value: 2, tone: 'brick' },
      ],
      { width: 540, valueRoom: 40 },
    );
    expect(chart.domainMax).toBe(8);
    expect(chart.plotWidth).toBe(500);
    expect(chart.bars.map((b) => b.barWidth)).toEqual([500, 125]);
    expect(chart.bars[1]?.tone).toBe('brick');
    expect(chart.bars[0]?.barY).toBeLessThan(chart.bars[1]?.barY ?? 0);
    expect(chart.ticks.at(-1)?.x).toBe(500);
  });

  it('draws negative and non-numeric values as empty bars instead of failing', () => {
    const chart = layoutBarChart([
      { label: 'a', value: -3 },
      { label: 'b', value: Number.NaN },
    ]);
    expect(chart.bars.map((b) => b.barWidth)).toEqual([0, 0]);
    expect(chart.domainMax).toBe(1);
  });

  it('grows in height with each bar', () => {
    const one = layoutBarChart([{ label: 'a', value: 1 }]);
    const two = layoutBarChart([
      { label: 'a', value: 1 },
      { label: 'b', value: 1 },
    ]);
    expect(two.height).toBeGreaterThan(one.height);
  });
});

describe('shortenLabel', () => {
  it('keeps short labels and ends long ones with an ellipsis inside the limit', () => {
    expect(shortenLabel('Tray will not open', 40)).toBe('Tray will not open');
    const long = shortenLabel('Tray opens then closes again at once because the switch is worn', 20);
    expect([...long].length).toBeLessThanOrEqual(20);
    expect(long.endsWith('…')).toBe(true);
  });
});
