// Unit tests of the bench tools' input reader: zod problems become one readable error with an example.
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { readInput } from '@/lib/bench/input';
import { nonNegativeNumber, positiveNumber, temperatureC } from '@/lib/bench/numbers';

const schema = z.object({ capacitanceF: positiveNumber('Capacitance'), parts: z.array(z.object({ count: nonNegativeNumber('Count') })) });

describe('readInput', () => {
  it('passes valid input through', () => {
    expect(readInput(schema, { capacitanceF: 1e-6, parts: [] }, 'example')).toEqual({ ok: true, value: { capacitanceF: 1e-6, parts: [] } });
  });

  it('reports the first problem with the field message and the example', () => {
    expect(readInput(schema, { capacitanceF: 0, parts: [] }, '{ capacitanceF: 1e-6 }')).toEqual({
      ok: false,
      error: { message: 'Capacitance must be above zero.', example: '{ capacitanceF: 1e-6 }' },
    });
  });

  it('names the path of a problem inside a list', () => {
    const result = readInput(schema, { capacitanceF: 1, parts: [{ count: 1 }, { count: -1 }] }, 'x');
    expect(result.ok || result.error.message).toBe('parts.1.count: Count cannot be negative.');
  });

  it('refuses NaN, Infinity and non-numbers', () => {
    for (const capacitanceF of [Number.NaN, Number.POSITIVE_INFINITY, '1uF', null]) {
      const result = readInput(schema, { capacitanceF, parts: [] }, 'x');
      expect(result.ok || result.error.message).toBe('Capacitance must be a number.');
    }
  });

  it('keeps temperatures within what parts are rated for', () => {
    const t = z.object({ at: temperatureC('Temperature') });
    expect(readInput(t, { at: 85 }, 'x').ok).toBe(true);
    expect(readInput(t, { at: -60 }, 'x').ok).toBe(false);
    expect(readInput(t, { at: 250 }, 'x').ok).toBe(false);
  });

  it('writes a sentence where a schema has only the validator wording', () => {
    const bare = z.object({ ratedVoltageV: z.number() });
    expect(readInput(bare, { ratedVoltageV: Number.NaN }, '16 V')).toEqual({
      ok: false,
      error: { message: 'Rated voltage needs a number, e.g. 12.', example: '16 V' },
    });
  });
});
