// The invented chassis families: shared mechanisms and platforms that several machines are built on.
import type { DemoChassis } from './types';

export const demoChassis: DemoChassis[] = [
  {
    slug: 'quillmere-qm7-deck',
    makerSlug: 'quillmere',
    name: 'QM-7 video deck mechanism',
    code: 'QM-7',
    deviceType: 'vcr',
    about: 'Front-loading VHS mechanism with a belt-driven reel idler and a rotary mode switch under the cam gear.',
  },
  {
    slug: 'tamberlyn-tv5-deck',
    makerSlug: 'tamberlyn',
    name: 'TV-5 video deck mechanism',
    code: 'TV-5',
    deviceType: 'vcr',
    about: 'Lightweight VHS mechanism with a centre drive belt to the reel gears and a plastic loading gear train.',
  },
  {
    slug: 'tamberlyn-tl2-loader',
    makerSlug: 'tamberlyn',
    name: 'TL-2 DVD recorder loader platform',
    code: 'TL-2',
    deviceType: 'dvd_recorder',
    about: 'Tray loader with a small belt from the loading motor to a worm pulley, and a sled-mounted recording pickup.',
  },
  {
    slug: 'orvalle-orx5-platform',
    makerSlug: 'orvalle',
    name: 'ORX-5 DVD-RAM recorder platform',
    code: 'ORX-5',
    deviceType: 'dvd_ram_recorder',
    about: 'DVD-RAM recorder platform with a cartridge-compatible tray, a forced-air cooled power supply and a vacuum fluorescent display.',
  },
  {
    slug: 'quillmere-qc3-combo',
    makerSlug: 'quillmere',
    name: 'QC-3 VHS/DVD combination platform',
    code: 'QC-3',
    deviceType: 'vhs_dvd_combo',
    about: 'A slimmed QM-7 tape deck stacked over a DVD recorder loader, sharing one switch-mode power supply.',
  },
  {
    slug: 'brindlecote-bt4-transport',
    makerSlug: 'brindlecote',
    name: 'BT-4 cassette transport',
    code: 'BT-4',
    deviceType: 'cassette_deck',
    about: 'Single-capstan belt-driven cassette transport with a separate reel motor and an idler-tyre take-up drive.',
  },
  {
    slug: 'kestrune-kl9-transport',
    makerSlug: 'kestrune',
    name: 'KL-9 CD transport and laser platform',
    code: 'KL-9',
    deviceType: 'cd_player',
    about: 'CD transport with a belt-driven tray, a geared sled and a three-beam pickup on a spindle motor bracket.',
  },
  {
    slug: 'halvorin-hm2-mechanism',
    makerSlug: 'halvorin',
    name: 'HM-2 camcorder tape mechanism',
    code: 'HM-2',
    deviceType: 'camcorder',
    about: '8 mm camcorder mechanism with a spring-lifted cassette compartment, a dew sensor on the drum base and a tiny loading motor.',
  },
];
