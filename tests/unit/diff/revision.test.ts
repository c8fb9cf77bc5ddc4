// Whole revisions: which sections changed, with machines, cautions, parts and photos compared by identity.
import { describe, expect, it } from 'vitest';
import { diffRevisions, emptyComparable, type ComparableRevision } from '@/lib/diff';

const base: ComparableRevision = {
  title: 'Tray opens, then closes again',
  symptoms: ['Tray opens and closes at once', 'Clicking from the loader'],
  errorCodes: ['E21'],
  cause: 'The loading belt has stretched and slips.',
  bodyText: 'Unplug the recorder.\nRemove the top cover.\nFit a new belt.',
  parts: [{ ref: '', kind: 'belt', value: 'flat belt 92 mm x 4 mm', rating: '', quantity: 1, notes: '' }],
  readings: [],
  cautions: [{ kind: 'mains', detail: '' }],
  difficulty: 'careful',
  timeMinutes: 30,
  machines: ['Orvane DR-410 (PAL)'],
  chassis: [],
  photos: [{ id: 7, alt: 'Belt in place', caption: '' }],
};

describe('diffRevisions', () => {
  it('finds nothing to report between a revision and itself', () => {
    expect(diffRevisions(base, structuredClone(base)).changedSections).toEqual([]);
  });

  it('names each changed section in page order', () => {
    const after: ComparableRevision = {
      ...base,
      symptoms: [...base.symptoms, 'Display shows E21'],
      cautions: [{ kind: 'mains', detail: 'The inlet filter stays live.' }],
      bodyText: 'Unplug the recorder.\nRemove the top cover and the tray front.\nFit a new belt.',
      parts: [{ ...base.parts[0]!, quantity: 2 }],
      photos: [{ id: 9, alt: 'New belt', caption: 'Seated in the pulley groove' }],
    };
    const diff = diffRevisions(base, after);
    expect(diff.changedSections).toEqual(['Symptoms', 'Cautions', 'Remedy', 'Parts', 'Photos']);
    expect(diff.symptoms.added).toEqual(['Display shows E21']);
    expect(diff.photos.added.map((p) => p.id)).toEqual([9]);
    expect(diff.photos.removed.map((p) => p.id)).toEqual([7]);
    expect(diff.parts[0]!.cells.filter((c) => c.changed).map((c) => c.column)).toEqual(['quantity']);
  });

  it('shows a first revision as all added against the empty revision', () => {
    const diff = diffRevisions(emptyComparable, base);
    expect(diff.changedSections).toContain('Title');
    expect(diff.body.every((l) => l.kind === 'added')).toBe(true);
    expect(diff.parts.map((r) => r.status)).toEqual(['added']);
    expect(diff.machines.added).toEqual(['Orvane DR-410 (PAL)']);
  });

  it('reports a difficulty change in words', () => {
    const diff = diffRevisions(base, { ...base, difficulty: 'skilled' });
    expect(diff.changedSections).toEqual(['Difficulty and time']);
    expect(
      diff.difficulty
        .filter((s) => s.kind === 'added')
        .map((s) => s.text)
        .join(''),
    ).toContain('Skilled');
  });
});
