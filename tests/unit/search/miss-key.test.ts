// Searches that found nothing are counted by their folded words, never with anything that could name a person.
import { describe, expect, it } from 'vitest';
import { missKey } from '@/lib/search/miss-key';

describe('missKey', () => {
  it('folds case, accents, apostrophes and punctuation', () => {
    expect(missKey("  Tray WON'T  close!! ")).toBe('tray wont close');
    expect(missKey('Démagnétiser')).toBe('demagnetiser');
  });
  it('drops e-mail addresses, web addresses and long digit runs', () => {
    expect(missKey('call 0712 345 6789 or jo@example.test about www.example.test tray')).toBe('call or about tray');
    expect(missKey('order 123456789 tray')).toBe('order tray');
    expect(missKey('https://example.test/x')).toBeNull();
  });
  it('keeps model numbers and error codes, which are what editors need', () => {
    expect(missKey('KX-45N E-21')).toBe('kx-45n e-21');
  });
  it('answers null when nothing is left', () => {
    expect(missKey('  !!! ')).toBeNull();
  });
});
