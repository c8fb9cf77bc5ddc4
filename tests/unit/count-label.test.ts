import { describe, expect, it } from 'vitest';
import { countLabel, familyWorkLabel } from '@/lib/count-label';

describe('countLabel', () => {
  it('uses the singular for exactly one and the plural otherwise', () => {
    expect(countLabel(1, 'fix', 'fixes')).toBe('1 fix');
    expect(countLabel(0, 'fix', 'fixes')).toBe('0 fixes');
    expect(countLabel(12, 'bench report', 'bench reports')).toBe('12 bench reports');
  });
});

describe('familyWorkLabel', () => {
  it('joins fixes and bench reports with single spaces', () => {
    expect(familyWorkLabel({ fixes: 1, reports: 4 })).toBe('1 fix · 4 bench reports');
    expect(familyWorkLabel({ fixes: 3, reports: 1 })).toBe('3 fixes · 1 bench report');
  });
});
