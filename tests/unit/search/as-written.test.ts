// Family terms the English index cannot search as meant ("no power", "switches off") get a query over the words as written.
import { describe, expect, it } from 'vitest';
import { asWrittenQuery } from '@/server/search/word-families';

// Words with their English (snowball) stems as PostgreSQL's to_tsvector('english', …) gives them; '' where the
// dictionary drops the word as a stop word.
const w = (word: string, stem: string) => ({ word, stem });

describe('asWrittenQuery', () => {
  it('writes a phrase closing on a dropped particle with each word by its stem as a prefix', () => {
    expect(asWrittenQuery([w('switches', 'switch'), w('off', '')])).toBe(`'switch':* <-> 'off'`);
  });

  it('keeps a negation the index drops, wherever it stands', () => {
    expect(asWrittenQuery([w('does', ''), w('not', ''), w('rotate', 'rotat')])).toBe(`'does' <-> 'not' <-> 'rotat':*`);
    expect(asWrittenQuery([w('no', ''), w('power', 'power')])).toBe(`'no' <-> 'power':*`);
  });

  it('takes the common start of word and stem, so every form is found ("standby" stems to standbi)', () => {
    expect(asWrittenQuery([w('goes', 'goe'), w('to', ''), w('standby', 'standbi'), w('off', '')])).toBe(
      `'goe':* <-> 'to' <-> 'standb':* <-> 'off'`,
    );
  });

  it('leaves alone terms the English query already keeps whole', () => {
    expect(asWrittenQuery([w('won', 'won'), w('t', ''), w('close', 'close')])).toBeNull();
    expect(asWrittenQuery([w('disc', 'disc'), w('tray', 'tray')])).toBeNull();
    expect(asWrittenQuery([w('dead', 'dead')])).toBeNull();
  });

  it('quotes an apostrophe inside a word', () => {
    expect(asWrittenQuery([w("o'clock", "o'clock"), w('off', '')])).toBe(`'o''clock':* <-> 'off'`);
  });
});
