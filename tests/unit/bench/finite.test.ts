// Unit tests of the guard that keeps Infinity and NaN out of the bench tools' answers.
import { describe, expect, it } from 'vitest';
import { refuseNonFinite } from '@/lib/bench/finite';

describe('refuseNonFinite', () => {
  it('lets finite figures through, zero and negatives included', () => {
    expect(refuseNonFinite({ a: 0, b: -1.5, c: Number.MAX_VALUE }, 'example')).toBeUndefined();
  });

  it('names the first figure that is Infinity or NaN, with the example', () => {
    expect(refuseNonFinite({ 'time constant': 1, 'stored energy': Number.POSITIVE_INFINITY, power: Number.NaN }, '{ x: 1 }')).toEqual({
      ok: false,
      error: {
        message:
          'The stored energy comes out beyond the numbers this tool can work with: the inputs are far outside any real part. Check their units and size.',
        example: '{ x: 1 }',
      },
    });
    expect(refuseNonFinite({ power: Number.NaN }, 'e')?.error.message).toMatch(/^The power /);
  });
});
