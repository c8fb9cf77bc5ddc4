// Quantities, their SI units and the prefixes each one is written with on parts lists and markings.

export const quantities = ['capacitance', 'resistance', 'voltage', 'inductance', 'power', 'current'] as const;
export type Quantity = (typeof quantities)[number];

export type UnitSymbol = 'F' | 'Ω' | 'V' | 'H' | 'W' | 'A';

/** Canonical prefix symbols; micro is written with U+00B5 MICRO SIGN in canonical output. */
export type PrefixSymbol = 'p' | 'n' | 'µ' | 'm' | '' | 'k' | 'M' | 'G' | 'T';

export const prefixExponents: Record<PrefixSymbol, number> = {
  p: -12,
  n: -9,
  µ: -6,
  m: -3,
  '': 0,
  k: 3,
  M: 6,
  G: 9,
  T: 12,
};

export const unitOf: Record<Quantity, UnitSymbol> = {
  capacitance: 'F',
  resistance: 'Ω',
  voltage: 'V',
  inductance: 'H',
  power: 'W',
  current: 'A',
};

export const quantityOfUnit: Record<UnitSymbol, Quantity> = {
  F: 'capacitance',
  Ω: 'resistance',
  V: 'voltage',
  H: 'inductance',
  W: 'power',
  A: 'current',
};

/** "a capacitance", "an inductance": for messages. */
export function withArticle(quantity: Quantity): string {
  return `${quantity === 'inductance' ? 'an' : 'a'} ${quantity}`;
}

/** Example input per quantity, shown in error messages. */
export const exampleOf: Record<Quantity, string> = {
  capacitance: '4.7 µF, 4u7, 100nF or 104',
  resistance: '2.2 kΩ, 2k2, 4R7 or 470 ohm',
  voltage: '16 V, 16V, 16VDC or 16 WV',
  inductance: '10 µH or 4.7 mH',
  power: '0.25 W or 1/4 W',
  current: '1.2 A or 850 mA',
};

/**
 * Prefixes a reader may meet with each unit. Megafarads and kilofarads do not occur on parts, so
 * "10MF" is refused rather than read as 10 000 000 F.
 */
export const allowedPrefixes: Record<Quantity, readonly PrefixSymbol[]> = {
  capacitance: ['p', 'n', 'µ', 'm', ''],
  resistance: ['m', '', 'k', 'M', 'G', 'T'],
  voltage: ['µ', 'm', '', 'k'],
  inductance: ['n', 'µ', 'm', ''],
  power: ['µ', 'm', '', 'k'],
  current: ['n', 'µ', 'm', ''],
};

/**
 * Bands for the canonical form: the largest band whose lower edge is at or below the value wins.
 * Capacitance skips millifarads because the old "mf" meant microfarad, so "4700 µF" is the trade's
 * unambiguous form, and memory-backup capacitors read "0.1 F"; low resistances read "0.47 Ω" as on
 * current-sense parts; power keeps watts down to 0.1 W because resistor ratings read 0.125/0.25/0.5 W.
 */
export const formatBands: Record<Quantity, ReadonlyArray<{ prefix: PrefixSymbol; from: number }>> = {
  capacitance: [
    { prefix: 'p', from: 0 },
    { prefix: 'n', from: 1e-9 },
    { prefix: 'µ', from: 1e-6 },
    { prefix: '', from: 0.01 },
  ],
  resistance: [
    { prefix: 'm', from: 0 },
    { prefix: '', from: 0.01 },
    { prefix: 'k', from: 1e3 },
    { prefix: 'M', from: 1e6 },
    { prefix: 'G', from: 1e9 },
    { prefix: 'T', from: 1e12 },
  ],
  voltage: [
    { prefix: 'm', from: 0 },
    { prefix: '', from: 1 },
    { prefix: 'k', from: 1e3 },
  ],
  inductance: [
    { prefix: 'n', from: 0 },
    { prefix: 'µ', from: 1e-6 },
    { prefix: 'm', from: 1e-3 },
    { prefix: '', from: 1 },
  ],
  power: [
    { prefix: 'm', from: 0 },
    { prefix: '', from: 0.1 },
    { prefix: 'k', from: 1e3 },
  ],
  current: [
    { prefix: 'µ', from: 0 },
    { prefix: 'm', from: 1e-3 },
    { prefix: '', from: 1 },
  ],
};

/** Smallest and largest magnitudes (in base units) accepted, so formatting never needs an exponent. */
export function magnitudeRange(quantity: Quantity): { min: number; max: number } {
  const bands = formatBands[quantity];
  const smallest = bands[0]?.prefix ?? '';
  const largest = bands[bands.length - 1]?.prefix ?? '';
  return {
    min: Number(`1e${prefixExponents[smallest] - 3}`),
    max: Number(`1e${prefixExponents[largest] + 6}`),
  };
}
