// Small search helpers: the arrow keys in the live list, word-family form input, and the bench score wording.
import { describe, expect, it } from 'vitest';
import { nextActive } from '@/islands/search/active-option';
import { splitTerms, wordFamilyFormSchema } from '@/lib/search/word-family-schema';
import { benchScoreText } from '@/lib/search/bench-label';

describe('nextActive', () => {
  it('goes from the box to the first result, down the list, and wraps', () => {
    expect(nextActive(-1, 3, 'ArrowDown')).toBe(0);
    expect(nextActive(2, 3, 'ArrowDown')).toBe(0);
    expect(nextActive(-1, 3, 'ArrowUp')).toBe(2);
    expect(nextActive(1, 3, 'ArrowUp')).toBe(0);
    expect(nextActive(0, 0, 'ArrowDown')).toBe(-1);
  });
});

describe('word family form', () => {
  it('splits terms on lines and commas, trims and drops repeats whatever their case', () => {
    expect(splitTerms(' Tray \n drawer, DRAWER;;  disc   tray \n')).toEqual(['Tray', 'drawer', 'disc tray']);
  });
  it('keeps an invisible zero-width no-break space inside a term as typed rather than turning it into a space', () => {
    expect(splitTerms('E\uFEFF31\nE31')).toEqual(['E\uFEFF31', 'E31']);
  });
  it('asks for two terms at least and names the field', () => {
    const parsed = wordFamilyFormSchema.safeParse({ intent: 'create', name: 'tray', terms: 'tray' });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0]?.path).toEqual(['terms']);
  });
  it('reads an update and a retirement', () => {
    expect(wordFamilyFormSchema.parse({ intent: 'update', id: '4', name: ' belt ', terms: 'belt\nband' })).toEqual({
      intent: 'update',
      id: 4,
      name: 'belt',
      terms: ['belt', 'band'],
    });
    expect(wordFamilyFormSchema.parse({ intent: 'retire', id: '4' })).toEqual({ intent: 'retire', id: 4 });
    expect(wordFamilyFormSchema.safeParse({ intent: 'delete', id: '4' }).success).toBe(false);
  });
});

describe('benchScoreText', () => {
  it('always says how many reports the score rests on', () => {
    // 8 fixed of 10 gives a Wilson lower bound of 0.4902 at 95 % (Wilson 1927); shown as 0.49.
    expect(benchScoreText(0.4902, 10)).toBe('Bench score 0.49 from 10 bench reports');
    expect(benchScoreText(0.2065, 1)).toBe('Bench score 0.21 from 1 bench report');
    expect(benchScoreText(null, 0)).toBe('No bench reports yet');
  });
});
