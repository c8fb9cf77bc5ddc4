// Pages show fixed sentences for what a form post's address says, never the address's own text.
import { describe, expect, it } from 'vitest';
import { fixFlagSentence, formErrorSentence } from '@/lib/form-answers';

describe('formErrorSentence', () => {
  it('gives the fixed sentence of a known error code', () => {
    expect(formErrorSentence('conflict')).toBe(
      'It was changed meanwhile, so nothing was changed now. Reload the page to see where it stands, then try again.',
    );
    expect(formErrorSentence('unauthorised')).toContain('Sign in');
  });

  it('answers anything else in the address with the general sentence, never with the text given', () => {
    for (const planted of ['this fix was withdrawn', '<script>alert(1)</script>', 'toString', '__proto__', 'constructor']) {
      const sentence = formErrorSentence(planted);
      expect(sentence).toBe('That change was not made: something went wrong. Reload the page and try again in a minute.');
      expect(sentence).not.toContain(planted);
    }
  });

  it('says nothing when there is no code', () => {
    expect(formErrorSentence(null)).toBeNull();
    expect(formErrorSentence('')).toBeNull();
  });
});

describe('fixFlagSentence', () => {
  it('names what a lock or hide did, and nothing for other text', () => {
    expect(fixFlagSentence('hide')).toBe('Hidden: readers and search no longer see this fix.');
    expect(fixFlagSentence('deleted by the moderators')).toBeNull();
    expect(fixFlagSentence('__proto__')).toBeNull();
  });
});
