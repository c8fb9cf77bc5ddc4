// The invented machine catalogue: maker + model number + region variant, most on a chassis family.
import type { DemoMachine } from './types';

/** The key fixes use to point at a machine. */
export function machineKey(machine: Pick<DemoMachine, 'makerSlug' | 'modelNumber' | 'region'>): string {
  return `${machine.makerSlug}/${machine.modelNumber}/${machine.region}`;
}

const videoDecks: DemoMachine[] = [
  { makerSlug: 'quillmere', chassisSlug: 'quillmere-qm7-deck', modelNumber: 'VR-3100', region: 'PAL', deviceType: 'vcr', formats: ['VHS'], yearFrom: 1991, yearTo: 1995, about: 'Four-head mono VHS recorder, the first machine on the QM-7 deck.' },
  { makerSlug: 'quillmere', chassisSlug: 'quillmere-qm7-deck', modelNumber: 'VR-3100', region: 'NTSC', deviceType: 'vcr', formats: ['VHS'], yearFrom: 1991, yearTo: 1994, about: 'NTSC variant of the VR-3100 with a different tuner and video board.' },
  { makerSlug: 'quillmere', chassisSlug: 'quillmere-qm7-deck', modelNumber: 'VR-3150S', region: 'PAL', deviceType: 'vcr', formats: ['VHS', 'S-VHS'], yearFrom: 1993, yearTo: 1997, about: 'S-VHS hi-fi stereo recorder on the QM-7 deck with a larger power supply.' },
  { makerSlug: 'tamberlyn', chassisSlug: 'tamberlyn-tv5-deck', modelNumber: 'TV-820', region: 'PAL', deviceType: 'vcr', formats: ['VHS'], yearFrom: 1996, yearTo: 2000, about: 'Budget two-head VHS recorder on the TV-5 deck.' },
  { makerSlug: 'tamberlyn', chassisSlug: 'tamberlyn-tv5-deck', modelNumber: 'TV-825K', region: 'PAL', deviceType: 'vcr', formats: ['VHS'], yearFrom: 1998, yearTo: 2002, about: 'Hi-fi stereo version of the TV-820 with a jog dial.' },
  { makerSlug: 'tamberlyn', chassisSlug: 'tamberlyn-tv5-deck', modelNumber: 'TV-825K', region: 'NTSC', deviceType: 'vcr', formats: ['VHS'], yearFrom: 1998, yearTo: 2001, about: 'NTSC variant of the TV-825K.' },
  { makerSlug: 'halvorin', modelNumber: 'HB-200', region: 'NTSC', deviceType: 'vcr', formats: ['Betamax'], yearFrom: 1985, yearTo: 1988, about: 'Top-loading Betamax recorder with a belt-driven threading ring.' },
];

const discRecorders: DemoMachine[] = [
  { makerSlug: 'tamberlyn', chassisSlug: 'tamberlyn-tl2-loader', modelNumber: 'DR-4120', region: 'PAL', deviceType: 'dvd_recorder', formats: ['DVD-R', 'DVD-RW'], yearFrom: 2004, yearTo: 2007, about: 'Tuner DVD recorder on the TL-2 loader.' },
  { makerSlug: 'tamberlyn', chassisSlug: 'tamberlyn-tl2-loader', modelNumber: 'DR-4120', region: 'NTSC', deviceType: 'dvd_recorder', formats: ['DVD-R', 'DVD-RW'], yearFrom: 2004, yearTo: 2006, about: 'NTSC variant of the DR-4120.' },
  { makerSlug: 'tamberlyn', chassisSlug: 'tamberlyn-tl2-loader', modelNumber: 'DR-4120K', region: 'PAL', deviceType: 'dvd_recorder', formats: ['DVD-R', 'DVD+R', 'DVD-RW'], yearFrom: 2005, yearTo: 2008, about: 'Later DR-4120 with plus-format recording and a revised power supply.' },
  { makerSlug: 'kestrune', modelNumber: 'KD-560', region: 'PAL', deviceType: 'dvd_recorder', formats: ['DVD-R', 'DVD+R', 'DVD-RW'], yearFrom: 2006, yearTo: 2009, about: 'Compact DVD recorder with a small cooling fan and a separate power board.' },
  { makerSlug: 'orvalle', chassisSlug: 'orvalle-orx5-platform', modelNumber: 'RX-710', region: 'PAL', deviceType: 'dvd_ram_recorder', formats: ['DVD-RAM', 'DVD-R'], yearFrom: 2003, yearTo: 2006, about: 'First ORX-5 recorder; takes bare and cartridge DVD-RAM discs.' },
  { makerSlug: 'orvalle', chassisSlug: 'orvalle-orx5-platform', modelNumber: 'RX-710', region: 'NTSC', deviceType: 'dvd_ram_recorder', formats: ['DVD-RAM', 'DVD-R'], yearFrom: 2003, yearTo: 2005, about: 'NTSC variant of the RX-710.' },
  { makerSlug: 'orvalle', chassisSlug: 'orvalle-orx5-platform', modelNumber: 'RX-760H', region: 'PAL', deviceType: 'dvd_ram_recorder', formats: ['DVD-RAM', 'DVD-R', 'DVD-RW'], yearFrom: 2007, yearTo: 2010, about: 'ORX-5 recorder with an internal hard disc for time-shift.' },
];

const comboUnits: DemoMachine[] = [
  { makerSlug: 'quillmere', chassisSlug: 'quillmere-qc3-combo', modelNumber: 'VDC-900', region: 'PAL', deviceType: 'vhs_dvd_combo', formats: ['VHS', 'DVD-R', 'DVD-RW'], yearFrom: 2005, yearTo: 2009, about: 'VHS/DVD recorder for dubbing tapes to disc, on the QC-3 platform.' },
  { makerSlug: 'quillmere', chassisSlug: 'quillmere-qc3-combo', modelNumber: 'VDC-900', region: 'NTSC', deviceType: 'vhs_dvd_combo', formats: ['VHS', 'DVD-R', 'DVD-RW'], yearFrom: 2005, yearTo: 2008, about: 'NTSC variant of the VDC-900.' },
  { makerSlug: 'quillmere', chassisSlug: 'quillmere-qc3-combo', modelNumber: 'VDC-950T', region: 'PAL', deviceType: 'vhs_dvd_combo', formats: ['VHS', 'DVD-R', 'DVD+R', 'DVD-RW'], yearFrom: 2007, yearTo: 2011, about: 'Digital-tuner version of the VDC-900 with a larger heatsink on the power board.' },
  { makerSlug: 'orvalle', modelNumber: 'CX-330', region: 'PAL', deviceType: 'vhs_dvd_combo', formats: ['VHS', 'DVD-R', 'DVD+R', 'DVD-RAM'], yearFrom: 2006, yearTo: 2010, about: 'Orvalle combination recorder with its own tray loader.' },
];

const camcorders: DemoMachine[] = [
  { makerSlug: 'halvorin', chassisSlug: 'halvorin-hm2-mechanism', modelNumber: 'HC-8A', region: 'PAL', deviceType: 'camcorder', formats: ['Video8'], yearFrom: 1988, yearTo: 1992, about: 'Video8 camcorder with a monochrome tube viewfinder.' },
  { makerSlug: 'halvorin', chassisSlug: 'halvorin-hm2-mechanism', modelNumber: 'HC-8A', region: 'NTSC', deviceType: 'camcorder', formats: ['Video8'], yearFrom: 1988, yearTo: 1991, about: 'NTSC variant of the HC-8A.' },
  { makerSlug: 'halvorin', chassisSlug: 'halvorin-hm2-mechanism', modelNumber: 'HC-85H', region: 'PAL', deviceType: 'camcorder', formats: ['Video8', 'Hi8'], yearFrom: 1992, yearTo: 1997, about: 'Hi8 camcorder on the HM-2 mechanism with surface-mount electrolytics on the power board.' },
  { makerSlug: 'kestrune', modelNumber: 'KC-22D', region: 'PAL', deviceType: 'camcorder', formats: ['MiniDV'], yearFrom: 2001, yearTo: 2005, about: 'Palm-sized MiniDV camcorder with a side-opening cassette door.' },
  { makerSlug: 'kestrune', modelNumber: 'KC-22D', region: 'NTSC', deviceType: 'camcorder', formats: ['MiniDV'], yearFrom: 2001, yearTo: 2004, about: 'NTSC variant of the KC-22D.' },
];

const cassetteDecks: DemoMachine[] = [
  { makerSlug: 'brindlecote', chassisSlug: 'brindlecote-bt4-transport', modelNumber: 'TD-550', region: 'multi', deviceType: 'cassette_deck', formats: ['Compact Cassette'], yearFrom: 1985, yearTo: 1989, about: 'Two-head deck, the first on the BT-4 transport.' },
  { makerSlug: 'brindlecote', chassisSlug: 'brindlecote-bt4-transport', modelNumber: 'TD-570R', region: 'multi', deviceType: 'cassette_deck', formats: ['Compact Cassette'], yearFrom: 1988, yearTo: 1993, about: 'Auto-reverse deck on the BT-4 transport with a rotating head.' },
  { makerSlug: 'brindlecote', chassisSlug: 'brindlecote-bt4-transport', modelNumber: 'TD-590', region: 'multi', deviceType: 'cassette_deck', formats: ['Compact Cassette'], yearFrom: 1990, yearTo: 1995, about: 'Three-head deck with off-tape monitoring.' },
  { makerSlug: 'kestrune', modelNumber: 'KT-44', region: 'multi', deviceType: 'cassette_deck', formats: ['Compact Cassette'], yearFrom: 1990, yearTo: 1996, about: 'Slim single-motor deck with an idler-driven take-up.' },
];

const cdPlayers: DemoMachine[] = [
  { makerSlug: 'kestrune', chassisSlug: 'kestrune-kl9-transport', modelNumber: 'CP-720', region: 'multi', deviceType: 'cd_player', formats: ['CD'], yearFrom: 1992, yearTo: 1997, about: 'First player on the KL-9 transport.' },
  { makerSlug: 'kestrune', chassisSlug: 'kestrune-kl9-transport', modelNumber: 'CP-740', region: 'multi', deviceType: 'cd_player', formats: ['CD', 'CD-R'], yearFrom: 1996, yearTo: 2001, about: 'KL-9 player with a revised servo that reads recordable discs.' },
  { makerSlug: 'kestrune', chassisSlug: 'kestrune-kl9-transport', modelNumber: 'CP-760', region: 'multi', deviceType: 'cd_player', formats: ['CD', 'CD-R'], yearFrom: 1999, yearTo: 2004, about: 'Top KL-9 model with a linear power supply and a large reservoir capacitor.' },
  { makerSlug: 'brindlecote', modelNumber: 'BCD-15', region: 'multi', deviceType: 'cd_player', formats: ['CD'], yearFrom: 1994, yearTo: 1998, about: 'Brindlecote\'s only CD player, with a bought-in transport.' },
];

export const demoMachines: DemoMachine[] = [
  ...videoDecks,
  ...discRecorders,
  ...comboUnits,
  ...camcorders,
  ...cassetteDecks,
  ...cdPlayers,
];
