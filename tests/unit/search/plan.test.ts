// Planning a query from its pieces and the vocabulary: corrections, dropped words, codes, families.
import { describe, expect, it } from 'vitest';
import { buildPlan, correctWord, planTerms, type Vocabulary, type TextClause } from '@/lib/search/plan';
import { parseQuery } from '@/lib/search/tokens';
import type { WordFamily } from '@/lib/search/word-families';

const families: WordFamily[] = [
  { id: 1, name: 'tray', terms: ['tray', 'drawer', 'loader'] },
  { id: 2, name: 'negation', terms: ["won't", 'will not'] },
];

function vocabulary(extra: Partial<Vocabulary> = {}): Vocabulary {
  return {
    known: new Set(['tray', 'close', 'rewind', 'belt']),
    stopwords: new Set(['will', 'not', 'the', 'on']),
    candidates: new Map([
      [
        'tary',
        [
          { word: 'tray', ndoc: 9 },
          { word: 'tape', ndoc: 30 },
        ],
      ],
    ]),
    codes: ['kx44n', 'kx45n', 'dr4120', 'dr4120k'],
    ...extra,
  };
}

const texts = (clauses: ReturnType<typeof buildPlan>['clauses']) => clauses.filter((c): c is TextClause => c.kind === 'text');

describe('correctWord', () => {
  it('picks the fewest slips, then the most used word', () => {
    expect(
      correctWord('tary', [
        { word: 'tape', ndoc: 30 },
        { word: 'tray', ndoc: 9 },
      ]),
    ).toBe('tray');
    expect(
      correctWord('bolt', [
        { word: 'belt', ndoc: 3 },
        { word: 'boot', ndoc: 5 },
      ]),
    ).toBe('boot');
  });
  it('prefers a word of a word family when slips are equal', () => {
    expect(
      correctWord(
        'drawr',
        [
          { word: 'draw', ndoc: 9 },
          { word: 'drawer', ndoc: 1 },
        ],
        new Set(['drawer']),
      ),
    ).toBe('drawer');
  });
  it('does not correct short words or far-off ones', () => {
    expect(correctWord('ff', [{ word: 'fan', ndoc: 3 }])).toBeNull();
    expect(correctWord('zzzz', [{ word: 'tray', ndoc: 3 }])).toBeNull();
  });
});

describe('buildPlan', () => {
  it('corrects a misspelt word, then applies its word family', () => {
    const plan = buildPlan(parseQuery('tary wont close'), vocabulary(), families);
    expect(plan.corrections).toEqual([{ from: 'tary', to: 'tray' }]);
    expect(texts(plan.clauses).map((c) => [c.label, c.terms, c.alternatives])).toEqual([
      ['tray', ['tray'], ['drawer', 'loader']],
      ['wont', ["won't"], ['"will not"']],
      ['close', ['close'], []],
    ]);
  });

  it('drops an unknown first word and keeps what the others find', () => {
    const plan = buildPlan(parseQuery('xqzvw belt'), vocabulary(), families);
    expect(plan.ignored).toEqual(['xqzvw']);
    expect(texts(plan.clauses).map((c) => c.label)).toEqual(['belt']);
  });

  it('turns a loosely typed model number into a code clause with its variants', () => {
    const plan = buildPlan(parseQuery('DR 4120 tray'), vocabulary(), families);
    expect(plan.clauses.find((c) => c.kind === 'code')).toEqual({
      kind: 'code',
      label: 'dr4120',
      exact: ['dr4120'],
      variants: ['dr4120k'],
    });
  });

  it('keeps an unknown code as a literal that must be found as written', () => {
    const plan = buildPlan(parseQuery('KX-46N'), vocabulary(), families);
    expect(plan.clauses).toEqual([
      { kind: 'text', label: 'kx 46n', terms: ['kx46n', '"kx 46n"'], alternatives: [], soft: false, exact: true, position: -1 },
    ]);
  });

  it('leaves a bare number out instead of guessing a code', () => {
    const plan = buildPlan(parseQuery('stops after 1995'), vocabulary({ known: new Set(['stops', 'after']) }), families);
    expect(plan.ignored).toEqual(['1995']);
    expect(plan.clauses.every((c) => c.kind === 'text' && !c.exact)).toBe(true);
  });

  it('marks a family term of stop words only as soft', () => {
    const plan = buildPlan(parseQuery('tray will not close'), vocabulary(), families);
    const negation = texts(plan.clauses).find((c) => c.label === 'will not');
    expect(negation).toMatchObject({ soft: true, terms: ['"will not"'], alternatives: ["won't"] });
  });

  it('lists every term once for compiling', () => {
    const plan = buildPlan(parseQuery('tray tray -belt'), vocabulary(), families);
    expect(planTerms(plan)).toEqual(['tray', 'drawer', 'loader', 'belt']);
  });
});

describe('words a dictionary knows are never corrected into other words', () => {
  const withDictionary = (english: string[], related: [string, string[]][] = [], extra: Partial<Vocabulary> = {}) =>
    vocabulary({
      known: new Set(['tray', 'close', 'wobbles', 'place', 'eats', 'tape']),
      candidates: new Map([
        ['gobbles', [{ word: 'wobbles', ndoc: 4 }]],
        ['lace', [{ word: 'place', ndoc: 9 }]],
        ['tary', [{ word: 'tray', ndoc: 9 }]],
      ]),
      english: new Set(english),
      related: new Map(related),
      ...extra,
    });

  it('keeps "gobbles" and "lace" as typed: searched through their relatives, or left out', () => {
    const plan = buildPlan(parseQuery('gobbles tape'), withDictionary(['gobbles', 'lace'], [['gobbles', ['eat']]]), []);
    expect(plan.corrections).toEqual([]);
    expect(texts(plan.clauses).find((c) => c.label === 'gobbles')).toMatchObject({
      terms: ['gobbles'],
      alternatives: ['eat'],
      dictionary: true,
    });
    const lace = buildPlan(parseQuery('lace'), withDictionary(['gobbles', 'lace']), []);
    expect(lace.corrections).toEqual([]);
    expect(lace.ignored).toEqual(['lace']);
  });

  it('still corrects a slip that is no English word', () => {
    expect(buildPlan(parseQuery('tary'), withDictionary(['gobbles']), []).corrections).toEqual([{ from: 'tary', to: 'tray' }]);
  });

  it('searches a misspelt ending through the base form a fix uses: "skiping" as skip', () => {
    const plan = buildPlan(
      parseQuery('skiping cds'),
      withDictionary(['skiping', 'cds'], [], {
        inflections: new Map([
          ['skiping', 'skip'],
          ['cds', 'cd'],
        ]),
      }),
      [],
    );
    expect(plan.corrections).toEqual([
      { from: 'skiping', to: 'skip' },
      { from: 'cds', to: 'cd' },
    ]);
    expect(texts(plan.clauses).map((c) => c.terms)).toEqual([['skip'], ['cd']]);
  });

  it('reads two stored words run together as both words', () => {
    const plan = buildPlan(parseQuery('takeup tray'), withDictionary([], [], { compounds: new Map([['takeup', 'take up']]) }), []);
    expect(texts(plan.clauses).map((c) => c.label)).toEqual(['take', 'up', 'tray']);
  });
});

describe('negations rank but never decide a match', () => {
  it('makes "won\'t" and "not" soft, so "tray won\'t close" needs only tray and close', () => {
    const plan = buildPlan(parseQuery("tray won't close"), vocabulary({ known: new Set(['tray', 'close', 'wont']) }), families);
    const clauses = texts(plan.clauses);
    expect(clauses.filter((c) => !c.soft).map((c) => c.label)).toEqual(['tray', 'close']);
    expect(clauses.find((c) => c.label === 'wont')?.soft).toBe(true);
    const plain = buildPlan(parseQuery('not reading'), vocabulary({ known: new Set(['not', 'reading']), stopwords: new Set() }), []);
    expect(texts(plain.clauses).find((c) => c.label === 'not')?.soft).toBe(true);
  });
});
