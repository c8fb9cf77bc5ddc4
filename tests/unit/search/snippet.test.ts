// Snippets keep whole symptoms: a negation or a short first word is never cut off, and every cut shows "…".
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { MARK_END, MARK_START } from '@/lib/search/highlight';
import { SNIPPET_BUDGET, buildSnippet, readMarks } from '@/lib/search/snippet';

const openers = ['no', 'not', "won't", "doesn't", 'never', 'will not', 'slow', 'no', 'dead', 'a', 'it', 'tray'];
const words = [
  'rewind',
  'disc',
  'start-up',
  'picture',
  'tray',
  'close',
  'sound',
  'power',
  'eject',
  'spin',
  'clock',
  'display',
  'tape',
  'reads',
];

const plain = (html: string) =>
  html
    .replace(/<[^>]+>/g, '')
    .replace(/&#39;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&amp;/g, '&');

/** Symptoms as a fix holds them, and a marked copy with the chosen words marked as the engine would. */
const symptomList = fc.array(
  fc.record({
    opener: fc.constantFrom(...openers),
    rest: fc.array(fc.constantFrom(...words), { minLength: 1, maxLength: 8 }),
    markAt: fc.option(fc.nat(8), { nil: undefined }),
  }),
  { minLength: 1, maxLength: 9 },
);

function marked(list: { opener: string; rest: string[]; markAt?: number }[]): { symptoms: string[]; marked: string } {
  const symptoms = list.map((s) => [s.opener, ...s.rest].join(' '));
  const markedText = list
    .map((s) => {
      const all = [s.opener, ...s.rest];
      // The engine marks content words, never the negation that opens a symptom.
      const at = s.markAt === undefined ? -1 : 1 + (s.markAt % s.rest.length);
      return all.map((w, i) => (i === at ? `${MARK_START}${w}${MARK_END}` : w)).join(' ');
    })
    .join(' · ');
  return { symptoms, marked: markedText };
}

/** The pieces a snippet shows, split at its cuts and its separators. */
const shownPieces = (html: string) =>
  plain(html)
    .split(/ · | … |^… | …$/)
    .map((p) => p.trim())
    .filter(Boolean);

describe('buildSnippet', () => {
  it('shows only whole symptoms, so an opening negation or short word always stays with its symptom', () => {
    fc.assert(
      fc.property(symptomList, (list) => {
        const { symptoms, marked: text } = marked(list);
        const snippet = buildSnippet(text);
        for (const piece of shownPieces(snippet.html)) expect(symptoms).toContain(piece);
      }),
      { numRuns: 400 },
    );
  });

  it('shows every matched symptom whole, negation included, while within the budget', () => {
    fc.assert(
      fc.property(symptomList, (list) => {
        const { symptoms, marked: text } = marked(list);
        const snippet = buildSnippet(text);
        const shown = shownPieces(snippet.html);
        const matched = symptoms.filter((_s, i) => list[i]?.markAt !== undefined);
        // The first matched symptom is always there, in full.
        if (matched.length > 0) expect(shown).toContain(matched[0]);
        expect(shown.length).toBeGreaterThan(0);
      }),
      { numRuns: 400 },
    );
  });

  it('marks every cut with "…" and never adds one where nothing was left out', () => {
    fc.assert(
      fc.property(symptomList, (list) => {
        const { symptoms, marked: text } = marked(list);
        const snippet = buildSnippet(text);
        const shown = shownPieces(snippet.html);
        const allShown = shown.length === symptoms.length;
        expect(plain(snippet.html).includes('…')).toBe(!allShown);
      }),
      { numRuns: 400 },
    );
  });

  it('keeps "no rewind", "no disc" and "slow start-up" whole', () => {
    for (const symptom of [
      'no rewind',
      'no disc',
      'slow start-up',
      "won't eject",
      "doesn't spin",
      'never starts',
      'will not close',
      'not reading',
    ]) {
      const [first, ...rest] = symptom.split(' ');
      const text = `play works fine · ${first} ${MARK_START}${rest.join(' ')}${MARK_END} · clock is fine`;
      expect(plain(buildSnippet(text).html)).toContain(symptom);
    }
  });

  it('stays within the budget unless one symptom alone is longer', () => {
    const long = Array.from({ length: 12 }, (_, i) => `symptom number ${i} with ${MARK_START}tray${MARK_END} trouble`).join(' · ');
    const html = plain(buildSnippet(long).html);
    expect(html.length).toBeLessThanOrEqual(SNIPPET_BUDGET + 40);
    expect(html.endsWith(' …')).toBe(true);
  });

  it('shows a very long symptom by whole sentences and marks the cut', () => {
    const filler = 'The picture rolls slowly upwards and then settles for a while before it starts again.';
    const text = `${filler} ${filler} It will not ${MARK_START}rewind${MARK_END} at all. ${filler}`;
    const html = plain(buildSnippet(text).html);
    expect(html).toBe('… It will not rewind at all. …');
  });

  it('escapes the text and adds no tag but mark', () => {
    const snippet = buildSnippet(`<b>no</b> & ${MARK_START}rewind${MARK_END}`);
    expect(snippet.html).toBe('&lt;b&gt;no&lt;/b&gt; &amp; <mark>rewind</mark>');
  });
});

describe('concept highlights', () => {
  const typed = 'the disc drawer stops half way · no disc';
  it('highlights the word found through its family and says why', () => {
    const snippet = buildSnippet(typed, [
      { label: 'tray', marked: `the disc ${MARK_START}drawer${MARK_END} stops half way · no disc`, terms: [['drawer'], ['loader']] },
    ]);
    expect(snippet.html).toContain('<mark class="concept" title="matched: tray ≈ drawer">drawer</mark>');
    expect(snippet.matched).toEqual(['tray ≈ drawer']);
  });
  it('never marks one word of a phrase standing alone: "disc" is not "disc drawer"', () => {
    const snippet = buildSnippet(typed, [
      {
        label: 'tray',
        marked: `the ${MARK_START}disc${MARK_END} ${MARK_START}drawer${MARK_END} stops half way · no ${MARK_START}disc${MARK_END}`,
        terms: [['disc', 'drawer']],
      },
    ]);
    expect(snippet.matched).toEqual(['tray ≈ disc drawer']);
    expect(snippet.html).not.toContain('no <mark');
  });
  it('drops concept marks that do not line up with the text rather than the text', () => {
    const snippet = buildSnippet(typed, [{ label: 'tray', marked: 'something else', terms: [['drawer']] }]);
    expect(plain(snippet.html)).toBe(typed);
    expect(snippet.matched).toEqual([]);
  });
});

describe('readMarks', () => {
  it('reads marked ranges and drops stray markers', () => {
    expect(readMarks(`a ${MARK_START}b${MARK_END} c${MARK_END}`)).toEqual({ text: 'a b c', ranges: [[2, 3]] });
  });
});

describe('concept highlights line up word forms, not neighbours', () => {
  it('takes "drawers" for "drawer" and "spinning" for "spin", never "loads" for "loader"', () => {
    const text = `two ${MARK_START}drawers${MARK_END} · ${MARK_START}loads${MARK_END} slowly · not ${MARK_START}spinning${MARK_END}`;
    const snippet = buildSnippet('two drawers · loads slowly · not spinning', [
      { label: 'tray', marked: text, terms: [['drawer'], ['loader'], ['spin']] },
    ]);
    expect(snippet.matched).toEqual(['tray ≈ drawers', 'tray ≈ spinning']);
  });
});
