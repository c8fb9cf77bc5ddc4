// Demo fixes for VHS/DVD combination recorders: the disc side and the shared power supply.
import type { DemoFix } from '../types';
import { cap, caution, doc, figure, h, p, part, reading, rev, revise, steps } from './build';

const oxideLens = rev({
  title: 'DVD side shows NO DISC, tape side fine',
  symptoms: ['no disc', "won't read DVDs", 'disc error on the DVD side'],
  errorCodes: ['NO DISC'],
  cause:
    'In a combination unit the DVD loader sits over the tape deck, and oxide shed by old tapes drifts up onto the pickup lens. The film is darker and greasier than ordinary dust, and the pickup soon cannot focus on a blank disc.',
  body: doc(
    caution('laser', 'The QC-3 DVD pickup is a recording unit with a strong red laser; clean its lens only with the unit unplugged.'),
    steps(
      'Unplug the unit, remove the cover and slide the loader lid off.',
      'Wipe the lens once with a lens swab and isopropyl alcohol, from the centre outwards. Oxide film may need a second swab: never rub harder.',
      'Clean the tape deck heads and guides too, so the next tape does not send more oxide up.',
      'Test with a pressed disc and with a blank disc.',
    ),
  ),
  difficulty: 'routine',
  timeMinutes: 25,
  editSummary: 'First write-up.',
  author: 'tech-esme',
  proofer: 'moderator2',
});

const sharedPsuR1 = rev({
  title: 'Slow to start, or clicks and restarts, on both tape and disc',
  symptoms: ['slow start-up', 'clicks at switch-on', 'restarts by itself', 'display dim'],
  cause:
    'Both halves of the QC-3 run from one switch-mode supply. Its output capacitors stand close to the secondary heatsink and dry out, so the rails sag as the tape deck motors start and the controller resets.',
  body: doc(
    caution(
      'mains',
      'The QC-3 power board is the vertical board at the right-hand side, and its primary side faces you when the cover is off. It is at mains potential whenever the unit is plugged in.',
    ),
    caution(
      'stored_charge',
      'The reservoir capacitor (100uF 400V) can hold over 300 V for minutes after unplugging. Measure it and discharge it through a 2k2 5 W resistor.',
    ),
    caution('heat', 'The secondary heatsink is hot after a bench run; let it cool before desoldering nearby.'),
    steps(
      'Unplug, remove the cover, measure and discharge the reservoir capacitor.',
      'Remove the power board (two screws and three connectors).',
      'Replace C851, C852, C855 and C857 with 105 °C low-ESR parts of the same value and at least the same voltage.',
      'Refit, then start the unit and load a tape: the display must stay steady while the deck motors run.',
    ),
    reading({
      testPoint: '5 V rail at C852 while a tape loads',
      expected: '5.0 V, dipping no lower than 4.8 V',
      measured: 'dips to 4.2 V and the unit resets',
    }),
  ),
  parts: [
    cap('C851', '1000uF', '10V 105C low-ESR', '3.3 V rail'),
    cap('C852', '1000uF', '10V 105C low-ESR', '5 V rail'),
    cap('C855', '680uF', '16V 105C low-ESR', '12 V motor rail'),
    cap('C857', '100uF', '35V 105C', 'tuner supply'),
  ],
  difficulty: 'skilled',
  timeMinutes: 60,
  editSummary: 'First write-up.',
  author: 'tech-jonah',
  proofer: 'moderator',
});

const sharedPsuR2 = revise(sharedPsuR1, {
  body: doc(
    ...sharedPsuR1.body.content,
    h(3, 'VDC-950T'),
    p(
      "The digital-tuner model adds C859 (470uF 16V) on the tuner's 5 V feed behind the larger heatsink; replace it too or the tuner drops out when warm.",
    ),
  ),
  parts: [...sharedPsuR1.parts, cap('C859', '470uF', '16V 105C low-ESR', 'VDC-950T tuner feed only')],
  editSummary: 'Added the extra tuner capacitor on the VDC-950T.',
  author: 'editor',
  proofer: 'moderator2',
  illustrations: [
    figure(
      'bulging-capacitor',
      'Drawing of a capacitor with a domed top beside a heatsink.',
      'A dried-out output capacitor beside the QC-3 secondary heatsink.',
    ),
  ],
});

const cxTray = rev({
  title: 'Tray will not open, motor hums, LD ERR 1',
  symptoms: ["tray won't open", 'motor hums', 'LD ERR 1 on display'],
  errorCodes: ['LD ERR 1'],
  cause:
    "LD ERR 1 is Orvalle's code for a tray that did not reach its switch. The CX-330 loader has a tiny belt from the loading motor that goes slack and shiny, and the motor spins without moving the tray.",
  body: doc(
    p('Unplug the unit. The loader comes out with two screws at the front and one at the back.'),
    steps(
      'Remove the top cover and the loader.',
      'Turn the loader over; the belt runs from the motor to the white pulley on the right.',
      'Clean both pulleys and fit the new belt.',
      'Refit and test open and close twenty times.',
    ),
  ),
  parts: [part('belt', 'square belt 1.2 mm section, 27 mm inside diameter', { notes: 'CX-330 loading belt' })],
  difficulty: 'routine',
  timeMinutes: 25,
  editSummary: 'First write-up.',
  author: 'member',
  proofer: 'moderator2',
});

export const comboDiscSideFixes: DemoFix[] = [
  {
    slug: 'qc3-dvd-side-no-disc-oxide-on-lens',
    machines: ['quillmere/VDC-900/PAL', 'quillmere/VDC-950T/PAL'],
    chassis: ['quillmere-qc3-combo'],
    revisions: [oxideLens],
  },
  {
    slug: 'qc3-slow-start-shared-supply',
    machines: ['quillmere/VDC-900/PAL', 'quillmere/VDC-900/NTSC', 'quillmere/VDC-950T/PAL'],
    chassis: ['quillmere-qc3-combo'],
    revisions: [sharedPsuR1, sharedPsuR2],
  },
  { slug: 'cx330-tray-will-not-open', machines: ['orvalle/CX-330/PAL'], chassis: [], revisions: [cxTray] },
];
