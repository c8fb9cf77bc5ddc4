// Unit tests of the text normaliser used for parts without an electrical value.
import { describe, expect, it } from 'vitest';
import { normaliseText } from '@/lib/values/text-key';

describe('normaliseText', () => {
  it('lower-cases and collapses spaces', () => {
    expect(normaliseText('  Square   BELT  ')).toBe('square belt');
  });

  it('writes sizes one way', () => {
    expect(normaliseText('92mm x 4mm')).toBe('92 mm x 4 mm');
    expect(normaliseText('92x4mm')).toBe('92 mm x 4 mm');
    expect(normaliseText('92 × 4 mm')).toBe('92 mm x 4 mm');
    expect(normaliseText('92*4 mm')).toBe('92 mm x 4 mm');
    expect(normaliseText('10 x 20 x 3 mm')).toBe('10 mm x 20 mm x 3 mm');
  });

  it('reads a decimal comma in a size as a decimal point', () => {
    expect(normaliseText('17 x 2,5 mm')).toBe('17 mm x 2.5 mm');
  });

  it('leaves a size without a unit alone', () => {
    expect(normaliseText('ring 17 x 2')).toBe('ring 17 x 2');
  });

  it('drops trailing punctuation', () => {
    expect(normaliseText('pinch roller, 13 mm.')).toBe('pinch roller, 13 mm');
  });
});
