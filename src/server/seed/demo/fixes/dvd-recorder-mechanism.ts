// Demo fixes for DVD recorders: tray loader and spindle faults.
import type { DemoFix } from '../types';
import { caution, doc, figure, p, part, reading, rev, revise, steps } from './build';

const trayBounceR1 = rev({
  title: 'Tray opens then closes again by itself',
  symptoms: ['tray opens then closes', "tray won't stay open", 'tray bounces back in'],
  cause:
    'The TL-2 tray is driven from the loading motor through a small rubber belt to a worm pulley. When the belt stretches and glazes it slips near the end of travel, the open switch is not reached in time, and the controller pulls the tray back in as if someone had pushed it.',
  body: doc(
    p('Unplug the recorder. The loader can be lifted out without disturbing the pickup.'),
    steps(
      'Remove the top cover: three screws at the back and one on each side.',
      'Unplug the two flat cables from the loader, remove its three screws and lift it out.',
      'Turn the loader over. The belt runs from the brass motor pulley to the white worm pulley at the rear corner.',
      'Remove the belt and clean both pulley grooves with isopropyl alcohol on a swab until no black comes off.',
      'Fit the new belt and turn the worm by hand: the tray must move smoothly through its whole travel.',
      'Refit the loader and run open and close twenty times, then leave the tray open for a minute to check that it stays out.',
    ),
  ),
  parts: [part('belt', 'square belt 1.2 mm section, 30 mm inside diameter', { notes: 'TL-2 loading belt' })],
  difficulty: 'routine',
  timeMinutes: 30,
  editSummary: 'First write-up.',
  author: 'member',
  proofer: 'moderator',
});

const trayBounceR2 = revise(trayBounceR1, {
  parts: [
    part('belt', 'square belt 1.2 mm section, 28 mm inside diameter', {
      notes: 'TL-2 loading belt; a 30 mm belt slips again within months',
    }),
  ],
  editSummary: 'Corrected the belt size to 28 mm: the 30 mm belt slips again within months.',
  author: 'tech-ansel',
  proofer: 'moderator2',
  illustrations: [
    figure(
      'belt-path',
      'Drawing of a small motor pulley and a larger pulley joined by a belt.',
      'TL-2 loading belt from the motor pulley to the worm pulley.',
    ),
  ],
});

const trayStuck = rev({
  title: 'Tray will not open, display shows E-21',
  symptoms: ["tray won't open", 'motor whirrs, tray stays shut', 'E-21 on display'],
  errorCodes: ['E-21'],
  cause:
    'E-21 is the TL-2 code for a tray that did not reach its end switch in time. If the belt is good, the loading cam gear is the usual reason: it jumped out of step with the tray rack when the tray was forced, or its hub has cracked and slips on the shaft.',
  body: doc(
    p(
      'Fit a new loading belt first if the old one is shiny or loose; a slipping belt also gives E-21. Unplug the recorder before you open it.',
    ),
    steps(
      'Remove the top cover and lift out the loader (three screws, two flat cables).',
      'Turn the white cam gear under the loader by hand towards open until the tray comes out far enough to grip, then slide it out.',
      'Look at the cam gear hub for a hairline crack running out from the shaft. A cracked gear must be replaced; glue does not hold.',
      'Turn the cam until its arrow points at the small hole in the loader frame.',
      'Slide the tray back in until the first tooth of its rack meets the cam gear, and push it home.',
      'Test open and close with and without a disc; E-21 should not return.',
    ),
  ),
  parts: [part('mechanical', 'TL-2 loading cam gear', { notes: 'replace if the hub is cracked' })],
  difficulty: 'careful',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-celia',
  proofer: 'moderator',
});

const spindle = rev({
  title: 'Disc spins up noisily, then F-12 and the tray opens',
  symptoms: ['grinding noise from disc', 'disc spins then stops', 'F-12 error', 'ejects disc after a few seconds'],
  errorCodes: ['F-12'],
  cause:
    'F-12 on Kestrune machines means the spindle did not reach a steady speed. On the KD-560 the spindle motor bearing dries out and its commutator wears, so the motor runs unevenly and the servo gives up.',
  body: doc(
    caution(
      'laser',
      'The spindle motor sits beside the recording pickup, which lights as soon as a disc is detected. Keep the pickup pointing away from your eyes when you test with the loader out.',
    ),
    steps(
      'Unplug the recorder, remove the top cover and the loader.',
      'Unplug the spindle motor from the drive board and measure its winding (reading below) while turning the turntable slowly by hand.',
      'Spin the turntable with a finger: a good motor runs on quietly; a worn one grates or stops at once.',
      'Replace the motor with its turntable fitted; do not press the turntable off the old motor, as its height is set at the factory.',
      'Refit and test with a pressed disc and a blank one.',
    ),
    reading({
      testPoint: 'Spindle motor terminals, motor disconnected',
      expected: '10-20 Ω, steady as the shaft turns',
      measured: 'jumps to open or near zero at some positions',
    }),
  ),
  parts: [part('motor', 'KD-560 spindle motor with turntable', { notes: 'comes with the turntable at factory height' })],
  difficulty: 'specialist',
  timeMinutes: 90,
  editSummary: 'First write-up.',
  author: 'tech-dmitri',
  proofer: 'moderator2',
});

const clamperArm = rev({
  title: 'Loading tray stops half way on closing, then reopens',
  symptoms: ['loading tray stops half way', 'tray reverses before it loads', 'disc not clamped'],
  cause:
    'In the last few millimetres of its closing travel the KD-560 tray lifts the clamper arm over the disc along a plastic cam track. The grease on the arm pivot dries and the cam follower wears a flat, so the tray meets a hard spot near the end of its travel. The controller sees the loaded switch too late and reverses the tray as if it had hit an obstruction.',
  body: doc(
    caution(
      'mains',
      'The KD-560 power board beside the loader has an uncovered primary side. Unplug the recorder before reaching past it; do not run the loader with the cover off and your hand near the board.',
    ),
    steps(
      'Unplug the recorder and remove the top cover.',
      'Remove the three screws of the loader top plate and lift it off with the clamper arm attached.',
      'Look at the cam follower on the clamper arm: a flat or a groove worn into its tip means the arm needs replacing.',
      'Clean the old grease from the arm pivot and the cam track with isopropyl alcohol on a swab.',
      'Apply a thin film of plastic-safe grease to the pivot and the track; none on the clamper magnet or the disc table.',
      'While the loader is open, check the loading belt for shine or slack and replace it if in doubt.',
      'Refit the plate and cycle the tray twenty times with a disc and twenty without.',
    ),
    reading({
      testPoint: 'Loaded switch S702, tray pushed fully home by hand',
      expected: 'closed, under 1 Ω',
      measured: 'open until the tray is pressed the last 2 mm',
      note: 'Unit unplugged, loader connector removed.',
    }),
  ),
  parts: [
    part('mechanical', 'clamper arm with cam follower', { notes: 'only if the follower tip is worn flat' }),
    part('belt', 'flat belt 2 mm wide, 30 mm inside diameter', { notes: 'KD-560 loading belt, replace while open' }),
  ],
  difficulty: 'careful',
  timeMinutes: 40,
  editSummary: 'First write-up.',
  author: 'tech-lucan',
  proofer: 'moderator',
  illustrations: [
    figure(
      'tray-gear',
      'Drawing of a small gear train with a timing mark lined up against an arrow.',
      'The loader gear train sits under the clamper arm; check its timing mark while the plate is off.',
    ),
  ],
});

export const dvdRecorderMechanismFixes: DemoFix[] = [
  {
    slug: 'tl2-tray-opens-then-closes',
    machines: ['tamberlyn/DR-4120/PAL', 'tamberlyn/DR-4120/NTSC', 'tamberlyn/DR-4120K/PAL'],
    chassis: ['tamberlyn-tl2-loader'],
    revisions: [trayBounceR1, trayBounceR2],
  },
  {
    slug: 'tl2-tray-will-not-open-e21',
    machines: ['tamberlyn/DR-4120K/PAL', 'tamberlyn/DR-4120/PAL'],
    chassis: ['tamberlyn-tl2-loader'],
    revisions: [trayStuck],
  },
  { slug: 'kd560-spindle-noisy-f12', machines: ['kestrune/KD-560/PAL'], chassis: [], revisions: [spindle] },
  { slug: 'kd560-tray-stops-halfway-clamper-arm', machines: ['kestrune/KD-560/PAL'], chassis: [], revisions: [clamperArm] },
];
