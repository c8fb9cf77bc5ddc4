// The kinds of caution, difficulty and part, with their labels, without zod: revision.ts builds its schemas on
// them and re-exports them; browser code that only shows them imports them from here.
export const cautionKinds = ['mains', 'stored_charge', 'laser', 'heat', 'sharp_edges', 'spring'] as const;
export type CautionKind = (typeof cautionKinds)[number];

export const cautionLabels: Record<CautionKind, string> = {
  mains: 'Mains voltage',
  stored_charge: 'Stored charge',
  laser: 'Laser radiation',
  heat: 'Hot parts',
  sharp_edges: 'Sharp edges',
  spring: 'Spring under tension',
};

export const difficulties = ['routine', 'careful', 'skilled', 'specialist'] as const;
export type Difficulty = (typeof difficulties)[number];

export const difficultyLabels: Record<Difficulty, string> = {
  routine: 'Routine: basic hand tools',
  careful: 'Careful: some disassembly',
  skilled: 'Skilled: soldering and measuring',
  specialist: 'Specialist: alignment or live work',
};

export const partKinds = [
  'capacitor',
  'resistor',
  'diode',
  'transistor',
  'ic',
  'fuse',
  'belt',
  'idler_tyre',
  'pinch_roller',
  'switch',
  'motor',
  'optical_pickup',
  'lamp',
  'connector',
  'mechanical',
  'other',
] as const;
export type PartKind = (typeof partKinds)[number];
