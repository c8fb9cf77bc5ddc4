// The pure rules of notifications: delivery fallbacks, the digest week, the one-line change summary.
import { describe, expect, it } from 'vitest';
import { changedFieldsLine, effectiveDeliveries, kindDescriptions, notificationKinds, weekStart } from '@/lib/notifications/kinds';

describe('effectiveDeliveries', () => {
  it('keeps what the member chose and falls back per kind for the rest', () => {
    const chosen = effectiveDeliveries({ fix_proofed: 'now' });
    expect(chosen.fix_proofed).toBe('now');
    expect(chosen.fault_came_back).toBe(kindDescriptions.fault_came_back.fallback);
    expect(Object.keys(chosen).sort()).toEqual([...notificationKinds].sort());
  });
});

describe('weekStart (ISO 8601 weeks start on Monday; UTC)', () => {
  it.each([
    ['2026-11-16T00:00:00Z', '2026-11-16'], // a Monday at midnight is its own week's start
    ['2026-11-22T23:59:59Z', '2026-11-16'], // the Sunday after belongs to the same week
    ['2026-11-23T00:00:00Z', '2026-11-23'],
    ['2027-01-01T12:00:00Z', '2026-12-28'], // a Friday across the new year (from a calendar)
    ['2024-02-29T08:00:00Z', '2024-02-26'], // a leap day (from a calendar)
  ])('%s is in the week of %s', (at, monday) => {
    const start = weekStart(new Date(at));
    expect(start.toISOString().slice(0, 10)).toBe(monday);
    expect(start.getUTCDay()).toBe(1);
  });
});

describe('changedFieldsLine', () => {
  it('names a new fix, wording-only changes and changed fields', () => {
    expect(changedFieldsLine([], true)).toBe('A new fix.');
    expect(changedFieldsLine([], false)).toBe('Wording changes only.');
    expect(changedFieldsLine(['parts', 'cautions'], false)).toBe('Changed: parts, cautions.');
  });
});
