// Word families in queries: longest term first, family spelling kept, every other term offered.
import { describe, expect, it } from 'vitest';
import { familyVocabulary, matchFamilies, termWords, type WordFamily } from '@/lib/search/word-families';

const families: WordFamily[] = [
  { id: 1, name: 'tray', terms: ['tray', 'drawer', 'loader', 'disc tray'] },
  { id: 2, name: 'negation', terms: ["won't", 'will not', 'does not'] },
  { id: 3, name: 'disc not read', terms: ['no disc', 'disc error', "won't read"] },
];

describe('termWords', () => {
  it('folds a term the way queries are folded', () => {
    expect(termWords("Won't")).toEqual(['wont']);
    expect(termWords('e-cap')).toEqual(['e', 'cap']);
  });
});

describe('matchFamilies', () => {
  it('finds terms typed without the apostrophe and offers the other terms', () => {
    const spans = matchFamilies(['tray', 'wont', 'close'], families);
    expect(spans).toEqual([
      { from: 0, to: 1, term: 'tray', alternatives: ['drawer', 'loader', 'disc tray'], familyNames: ['tray'] },
      { from: 1, to: 2, term: "won't", alternatives: ['will not', 'does not'], familyNames: ['negation'] },
    ]);
  });

  it('prefers the longest term: "wont read" is a disc fault, not a negation', () => {
    const spans = matchFamilies(['disc', 'wont', 'read'], families);
    expect(spans.map((s) => s.term)).toEqual(["won't read"]);
    expect(spans[0]).toMatchObject({ from: 1, to: 3 });
  });

  it('matches multi-word terms such as "will not"', () => {
    expect(matchFamilies(['tray', 'will', 'not', 'open'], families).map((s) => s.term)).toEqual(['tray', 'will not']);
  });

  it('matches a family phrase said with another "not": "no spin" and "does not spin" as "won\'t spin"', () => {
    const spinning: WordFamily[] = [{ id: 4, name: 'not spinning', terms: ["won't spin", 'not spinning', "doesn't rotate"] }];
    const noSpin = matchFamilies(['cd', 'no', 'spin'], spinning);
    expect(noSpin).toEqual([
      { from: 1, to: 3, term: "won't spin", alternatives: ['not spinning', "doesn't rotate"], familyNames: ['not spinning'] },
    ]);
    expect(matchFamilies(['disc', 'does', 'not', 'spin'], spinning)).toMatchObject([{ from: 1, to: 4, term: "won't spin" }]);
  });

  it('keeps the spelling typed when a term spells it exactly', () => {
    expect(matchFamilies(['not', 'spinning'], [{ id: 4, name: 'not spinning', terms: ["won't spin", 'not spinning'] }])).toMatchObject([
      { from: 0, to: 2, term: 'not spinning', alternatives: ["won't spin"] },
    ]);
  });

  it('never reads "no" alone as a phrase of the family', () => {
    expect(matchFamilies(['no', 'picture'], [{ id: 4, name: 'not spinning', terms: ["won't spin"] }])).toEqual([]);
  });

  it('ignores retired families simply by not being given them', () => {
    expect(matchFamilies(['drawer'], [])).toEqual([]);
  });
});

describe('familyVocabulary', () => {
  it('holds every word of every term', () => {
    expect([...familyVocabulary(families)].sort()).toEqual(
      ['disc', 'does', 'drawer', 'error', 'loader', 'no', 'not', 'read', 'tray', 'will', 'wont'].sort(),
    );
  });
});
