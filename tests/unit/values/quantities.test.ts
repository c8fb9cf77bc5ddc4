// Unit tests of the quantity tables: ranges, articles and the prefixes each unit takes.
import { describe, expect, it } from 'vitest';
import { allowedPrefixes, formatBands, magnitudeRange, quantities, withArticle } from '@/lib/values/quantities';

describe('quantities', () => {
  it('accepts from a thousandth of the smallest canonical prefix to a million of the largest', () => {
    expect(magnitudeRange('capacitance')).toEqual({ min: 1e-15, max: 1e6 });
    expect(magnitudeRange('resistance')).toEqual({ min: 1e-6, max: 1e18 }); // up to teraohms, the RKM letter T
  });

  it('writes every quantity only with prefixes it also reads', () => {
    for (const quantity of quantities) {
      for (const band of formatBands[quantity]) expect(allowedPrefixes[quantity], quantity).toContain(band.prefix);
    }
  });

  it('never lets farads take kilo or mega', () => {
    expect(allowedPrefixes.capacitance).not.toContain('k');
    expect(allowedPrefixes.capacitance).not.toContain('M');
  });

  it('puts the right article before a quantity', () => {
    expect(withArticle('inductance')).toBe('an inductance');
    expect(withArticle('voltage')).toBe('a voltage');
  });
});
