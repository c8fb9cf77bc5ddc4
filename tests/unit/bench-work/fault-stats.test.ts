// Unit tests of the statistics helpers: outcome tallies, the fixed bar order, the top faults.
import { describe, expect, it } from 'vitest';
import { faultBars, outcomeBars, tallyOutcomes, topFaults, totalOf } from '@/lib/stats/fault-stats';

describe('tallyOutcomes', () => {
  it('adds counts per outcome, reading counts that arrive as text from PostgreSQL', () => {
    const tally = tallyOutcomes([
      { outcome: 'fixed', count: '7' },
      { outcome: 'partly', count: 2 },
      { outcome: 'came_back', count: '1' },
      { outcome: 'fixed', count: 1 },
    ]);
    expect(tally).toEqual({ fixed: 8, partly: 2, not_fixed: 0, came_back: 1 });
    expect(totalOf(tally)).toBe(11);
  });

  it('skips an outcome it does not know rather than counting it somewhere', () => {
    expect(totalOf(tallyOutcomes([{ outcome: 'exploded', count: 3 }]))).toBe(0);
  });
});

describe('outcomeBars', () => {
  it('always gives all four outcomes in the same order, zeros included', () => {
    const bars = outcomeBars({ fixed: 0, partly: 0, not_fixed: 4, came_back: 1 });
    expect(bars.map((b) => b.label)).toEqual(['Fixed', 'Partly fixed', 'Not fixed', 'Fault came back']);
    expect(bars.map((b) => b.value)).toEqual([0, 0, 4, 1]);
  });
});

describe('topFaults', () => {
  const rows = [
    { slug: 'a', title: 'Tray will not open', reports: 3 },
    { slug: 'b', title: 'No rewind', reports: 9 },
    { slug: 'c', title: 'Chews tape', reports: 3 },
    { slug: 'd', title: 'Dead, no clock', reports: 0 },
    { slug: 'e', title: 'Noisy spindle', reports: 1 },
    { slug: 'f', title: 'Muffled audio', reports: 2 },
    { slug: 'g', title: 'Dim display', reports: 1 },
  ];

  it('keeps the five most reported, most first, ties by title', () => {
    expect(topFaults(rows).map((r) => r.slug)).toEqual(['b', 'c', 'a', 'f', 'g']);
  });

  it('leaves out fixes without reports and honours a smaller limit', () => {
    expect(topFaults(rows, 10).map((r) => r.slug)).not.toContain('d');
    expect(topFaults(rows, 2)).toHaveLength(2);
    expect(topFaults(rows, -1)).toEqual([]);
  });

  it('links each bar to its fix', () => {
    expect(faultBars(topFaults(rows, 1))[0]).toEqual({ label: 'No rewind', value: 9, href: '/fixes/b' });
  });
});
