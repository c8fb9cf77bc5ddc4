// The writing page's duplicate warning: when it asks, what it asks, and how answers for several targets merge.
import { describe, expect, it } from 'vitest';
import type { SimilarFix } from '@/lib/search/result-types';
import {
  MAX_SIMILAR_SHOWN,
  MAX_SIMILAR_TARGETS,
  mergeSimilar,
  similarHeading,
  similarPath,
  similarRequests,
  subjectText,
} from '@/lib/search/similar-request';

const draft = { title: '', symptoms: [] as string[], machines: [] as { slug?: string }[], chassis: [] as { slug?: string }[] };

function fix(slug: string, likeness: number, sameMachine = true): SimilarFix {
  return { slug, title: slug, symptoms: [], machines: [], sameMachine, likeness, benchScore: { score: null, reports: 0 } };
}

describe('subjectText', () => {
  it('takes the first written symptom, with spaces collapsed', () => {
    expect(subjectText({ title: 'Tray trouble', symptoms: ['', '  tray   will not open ', 'hums'] })).toBe('tray will not open');
  });

  it('falls back to the title while no symptom is written', () => {
    expect(subjectText({ title: ' Tray opens, then closes ', symptoms: ['  ', ''] })).toBe('Tray opens, then closes');
  });

  it('keeps to the 200 characters the endpoint takes', () => {
    expect(subjectText({ title: '', symptoms: ['word '.repeat(60)] }).length).toBeLessThanOrEqual(200);
  });
});

describe('similarRequests', () => {
  it('asks nothing without a machine or chassis family', () => {
    expect(similarRequests({ ...draft, symptoms: ['tray will not open'] })).toEqual([]);
  });

  it('asks nothing until the subject has a few letters', () => {
    const machines = [{ slug: 'orvane-dr410-pal' }];
    expect(similarRequests({ ...draft, machines, symptoms: ['tr'] })).toEqual([]);
    expect(similarRequests({ ...draft, machines, symptoms: ['?! -- ...'] })).toEqual([]);
    expect(similarRequests({ ...draft, machines, symptoms: ['tray'] })).toHaveLength(1);
  });

  it('asks once per machine and family named, machines first, up to the limit', () => {
    const requests = similarRequests({
      ...draft,
      title: 'Tray will not open',
      machines: [{ slug: 'm-one' }, { slug: 'm-two' }, { slug: 'm-three' }],
      chassis: [{ slug: 'family-one' }],
    });
    expect(requests).toHaveLength(MAX_SIMILAR_TARGETS);
    expect(requests.map((r) => r.target)).toEqual([
      { kind: 'machine', slug: 'm-one' },
      { kind: 'machine', slug: 'm-two' },
      { kind: 'machine', slug: 'm-three' },
    ]);
    expect(similarRequests({ ...draft, title: 'Tray will not open', chassis: [{ slug: 'family-one' }] })).toEqual([
      { symptom: 'Tray will not open', target: { kind: 'chassis', slug: 'family-one' } },
    ]);
  });

  it('skips refs without a slug (restored from an older journal)', () => {
    expect(similarRequests({ ...draft, symptoms: ['tray will not open'], machines: [{}, { slug: 'm-two' }] })).toEqual([
      { symptom: 'tray will not open', target: { kind: 'machine', slug: 'm-two' } },
    ]);
  });
});

describe('similarPath', () => {
  it('names the target by its kind and encodes the symptom', () => {
    expect(similarPath({ symptom: "tray won't open & clicks", target: { kind: 'chassis', slug: 'tl-2' } })).toBe(
      '/api/v1/search/similar?symptom=tray+won%27t+open+%26+clicks&chassis=tl-2',
    );
  });
});

describe('mergeSimilar', () => {
  it('shows a fix found through two machines once, with its best likeness', () => {
    const merged = mergeSimilar([[fix('a', 0.6, false), fix('b', 0.7)], [fix('a', 0.9, true)]], null);
    expect(merged).toEqual([fix('a', 0.9, true), fix('b', 0.7)]);
  });

  it('leaves out the fix being edited', () => {
    expect(mergeSimilar([[fix('editing', 1), fix('other', 0.5)]], 'editing').map((f) => f.slug)).toEqual(['other']);
  });

  it('orders best first, the same machine before the family on a tie, and keeps to the limit', () => {
    const many = Array.from({ length: 8 }, (_, i) => fix(`f${i}`, (50 + i) / 100));
    const merged = mergeSimilar([many.slice(0, 4), many.slice(4)], null);
    expect(merged).toHaveLength(MAX_SIMILAR_SHOWN);
    expect(merged.map((f) => f.slug)).toEqual(['f7', 'f6', 'f5', 'f4', 'f3']);
    expect(mergeSimilar([[fix('family', 0.6, false), fix('own', 0.6, true)]], null).map((f) => f.slug)).toEqual(['own', 'family']);
  });

  it('is empty when nothing came back', () => {
    expect(mergeSimilar([[], []], null)).toEqual([]);
  });
});

describe('similarHeading', () => {
  it('says whether the fixes are for the machine, its family or both', () => {
    expect(similarHeading([fix('a', 0.8)], true)).toBe('This fix for this machine looks similar');
    expect(similarHeading([fix('a', 0.8), fix('b', 0.7)], true)).toBe('These fixes for this machine look similar');
    expect(similarHeading([fix('a', 0.8, false)], true)).toBe("This fix for this machine's chassis family looks similar");
    expect(similarHeading([fix('a', 0.8), fix('b', 0.7, false)], true)).toBe(
      'These fixes for this machine and its chassis family look similar',
    );
    expect(similarHeading([fix('a', 0.8, false)], false)).toBe('This fix for this chassis family looks similar');
  });
});
