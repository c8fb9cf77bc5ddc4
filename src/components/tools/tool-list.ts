// The bench tools: one line on what each does and the published source its figures come from.

export interface ToolEntry {
  slug: string;
  href: string;
  name: string;
  summary: string;
  source: string;
}

export const benchTools: readonly ToolEntry[] = [
  {
    slug: 'value-decoder',
    href: '/tools/value-decoder',
    name: 'Value decoder',
    summary: 'Reads a value as written or marked (4u7, 2k2, 4R7, 104, 16 WV, ±10 %) and writes it one canonical way.',
    source: 'IEC 60062:2016 marking codes for resistors and capacitors; SI prefixes.',
  },
  {
    slug: 'preferred-values',
    href: '/tools/preferred-values',
    name: 'Preferred values',
    summary: 'Finds the nearest E3 to E192 value to a measured or calculated one, with its neighbours.',
    source: 'IEC 60063:2015 preferred number series for resistors and capacitors.',
  },
  {
    slug: 'substitute-check',
    href: '/tools/substitute-check',
    name: 'Substitute check',
    summary: 'Says whether one electrolytic capacitor can replace another: value, voltage, headroom, class, ESR, ripple, size, polarity.',
    source: 'The parts’ own ratings; 1.25 × working voltage headroom is common practice, not a standard.',
  },
  {
    slug: 'esr',
    href: '/tools/esr',
    name: 'ESR reference',
    summary: 'Works out the largest ESR a new general-purpose electrolytic may have and judges a measured ESR against it.',
    source:
      'tan δ = 2πf·C·ESR, the dissipation factor of a series R–C (circuit theory); typical tan δ limits of general-purpose aluminium electrolytics at 120 Hz, 20 °C, from memory, not one named datasheet.',
  },
  {
    slug: 'life-estimate',
    href: '/tools/life-estimate',
    name: 'Life estimate',
    summary: 'Estimates an electrolytic’s life at the temperature it runs at, to show why parts beside a hot heatsink fail first.',
    source: 'The 10-kelvin rule of capacitor makers’ application guides.',
  },
  {
    slug: 'bleed-down',
    href: '/tools/bleed-down',
    name: 'Bleed-down time',
    summary: 'Works out how long a bleed resistor takes to bring a stored charge down to a safe voltage, and what the resistor must take.',
    source: 'RC discharge, V(t) = V₀·e^(−t/RC), from circuit theory; the 60 V DC ES1 limit of IEC 62368-1.',
  },
];

export function toolBySlug(slug: string): ToolEntry {
  const tool = benchTools.find((t) => t.slug === slug);
  if (!tool) throw new Error(`No bench tool "${slug}".`);
  return tool;
}
