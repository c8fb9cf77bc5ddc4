// Text diffs: words within short fields, lines (with their changed words) within a remedy.
import { describe, expect, it } from 'vitest';
import { diffLinesOf, diffWordsOf, hasChanges } from '@/lib/diff';

const join = (spans: { kind: string; text: string }[], keep: string[]) =>
  spans
    .filter((s) => keep.includes(s.kind))
    .map((s) => s.text)
    .join('');

describe('diffWordsOf', () => {
  it('marks the replaced word and rebuilds both texts from the spans', () => {
    const spans = diffWordsOf('Replace the idler tyre', 'Replace the loading belt');
    expect(join(spans, ['same', 'removed'])).toBe('Replace the idler tyre');
    expect(join(spans, ['same', 'added'])).toBe('Replace the loading belt');
    expect(spans.filter((s) => s.kind === 'removed').map((s) => s.text.trim())).toEqual(['idler tyre']);
  });

  it('reports no change for identical text', () => {
    expect(hasChanges(diffWordsOf('same words', 'same words'))).toBe(false);
  });

  it('treats everything as added against an empty text', () => {
    expect(diffWordsOf('', 'new cause')).toEqual([{ kind: 'added', text: 'new cause' }]);
  });
});

describe('diffLinesOf', () => {
  it('pairs a removed and an added line into one changed line with its words marked', () => {
    const lines = diffLinesOf(
      'Unplug the deck.\nRemove four screws.\nLift the lid.',
      'Unplug the deck.\nRemove six screws.\nLift the lid.',
    );
    expect(lines.map((l) => l.kind)).toEqual(['same', 'changed', 'same']);
    const changed = lines[1]!;
    expect(changed.spans.filter((s) => s.kind === 'removed').map((s) => s.text)).toEqual(['four']);
    expect(changed.spans.filter((s) => s.kind === 'added').map((s) => s.text)).toEqual(['six']);
  });

  it('keeps extra lines as whole additions or removals', () => {
    const lines = diffLinesOf('One.\nTwo.', 'One.\nTwo.\nThree.\nFour.');
    expect(lines.map((l) => [l.kind, l.spans.map((s) => s.text).join('')])).toEqual([
      ['same', 'One.'],
      ['same', 'Two.'],
      ['added', 'Three.'],
      ['added', 'Four.'],
    ]);
    expect(diffLinesOf('Gone.', '').map((l) => l.kind)).toEqual(['removed']);
  });
});
