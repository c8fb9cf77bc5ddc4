// Demo fixes for CD players: the laser pickup, the sled, the spindle and its connector.
import type { DemoFix } from '../types';
import { caution, doc, h, p, part, reading, rev, revise, steps, table } from './build';

const skipsR1 = rev({
  title: 'Skips and mistracks on discs that play fine elsewhere',
  symptoms: ['skips', 'jumps tracks', 'stutters on some discs', 'reads slowly'],
  cause:
    'The KL-9 pickup lens sits in the open under the tray and gathers a film of dust and smoke. The error-correction copes at first, then the tracking servo starts to lose its place on discs with any blemish.',
  body: doc(
    caution(
      'laser',
      'The KL-9 pickup emits an invisible infrared laser beam while the player is on, with the tray closed or open. Clean the lens only with the player unplugged.',
    ),
    steps(
      'Unplug the player and remove the top cover (three screws at the back).',
      'With the tray open by hand (white pulley under the loader), blow loose dust off the lens.',
      'Wipe the lens once with a lens swab and isopropyl alcohol, in a spiral from the centre outwards, without pressing.',
      'Close up and play the disc that skipped.',
    ),
  ),
  difficulty: 'routine',
  timeMinutes: 15,
  editSummary: 'First write-up.',
  author: 'member',
  proofer: 'moderator',
});

const skipsR2 = revise(skipsR1, {
  body: doc(
    ...skipsR1.body.content,
    h(3, 'If it still skips'),
    p(
      'Check that the lens moves freely: with the player unplugged, press it down very gently with a cotton swab stick; it should spring back level. A lens that sticks or sits tilted means a worn pickup.',
    ),
  ),
  editSummary: 'Added the lens movement check for players that still skip after cleaning.',
  author: 'tech-celia',
  proofer: 'moderator2',
});

const weakLaserR1 = rev({
  title: 'NO DISC or F-07 with every disc, lens clean',
  symptoms: ['no disc', 'F-07 on display', "won't read discs", 'disc spins then stops'],
  errorCodes: ['F-07', 'NO DISC'],
  cause:
    'F-07 on the KL-9 means the focus servo found no disc surface. With a clean lens, the usual reason is a laser diode that has aged and no longer gives enough light to focus on.',
  body: doc(
    caution(
      'laser',
      'Measuring the laser current means running the KL-9 with the pickup exposed and its invisible infrared beam on. Keep the pickup pointing away from you and never look at the lens.',
    ),
    p('Measure the laser current before deciding on a new pickup:'),
    reading({
      testPoint: 'Across the 10 Ω sense resistor R108 beside the pickup connector',
      expected: '0.40-0.55 V (40-55 mA)',
      measured: 'over 0.65 V',
      note: 'A current well above the label on the pickup means the diode is worn.',
    }),
    steps(
      'Unplug the player, wear an earthed wrist strap and remove the loader.',
      'Undo the sled rod clamp and lift the pickup out with its rod.',
      'Fit the new pickup, plug in its flex, then remove the solder short on the flex.',
      'Refit and test with a pressed disc and a recordable one.',
    ),
    table(
      ['Current across R108', 'What it means'],
      ['40-55 mA', 'Laser healthy; look at focus or the disc motor'],
      ['over 65 mA', 'Laser worn; replace the pickup'],
    ),
  ),
  parts: [part('optical_pickup', 'KL-9 three-beam CD pickup', { notes: 'comes with a solder short on the flex' })],
  difficulty: 'specialist',
  timeMinutes: 75,
  editSummary: 'First write-up.',
  author: 'tech-dmitri',
  proofer: 'moderator2',
});

const weakLaserR2 = revise(weakLaserR1, {
  body: doc(
    ...weakLaserR1.body.content.slice(0, 3),
    p(
      'Do not turn up the laser power trimmer to compensate: it shortens the life of an already tired diode and rarely brings back a reliable read.',
    ),
    ...weakLaserR1.body.content.slice(3),
  ),
  editSummary: 'Added the warning against turning up the laser power trimmer.',
  author: 'moderator',
  proofer: 'moderator2',
});

const sled = rev({
  title: 'Plays the first tracks, then skips or stops further into the disc',
  symptoms: ['stops after track 3', 'skips on later tracks', 'cannot reach the last tracks'],
  cause:
    'The BCD-15 moves its pickup across the disc on a geared sled. The grease on its guide rod and worm hardens over the years, and the small sled motor can no longer push the pickup outwards smoothly.',
  body: doc(
    caution('laser', 'Do not test the sled with the BCD-15 powered and the pickup exposed; its infrared beam is invisible.'),
    steps(
      'Unplug the player and remove the top cover and the disc clamp bridge.',
      'Push the pickup gently outwards by turning the worm gear with a finger. It should move evenly; if it jerks, the grease has hardened.',
      'Clean the guide rods and the worm with isopropyl alcohol on a swab.',
      'Apply a very thin film of light plastic-safe grease to the rods and the worm only.',
      'Run the pickup end to end by hand, then play the last track of a full disc.',
    ),
  ),
  difficulty: 'careful',
  timeMinutes: 35,
  editSummary: 'First write-up.',
  author: 'tech-mina',
  proofer: 'moderator',
});

const spindle = rev({
  title: 'Disc will not spin, F-12 after a few seconds',
  symptoms: ['disc not spinning', 'F-12 on display', 'disc spins slowly then stops'],
  errorCodes: ['F-12'],
  cause:
    "F-12 is Kestrune's code for a spindle that never reached a steady speed. The CP-720 spindle motor wears its carbon brushes and commutator until it develops dead spots and will not start from some positions.",
  body: doc(
    caution('laser', 'The pickup lights while the spindle is tried; keep the pickup covered while the player is powered on the bench.'),
    steps(
      'Unplug the player, remove the top cover and the loader.',
      'Unplug the spindle motor and measure it while turning the turntable slowly (reading below).',
      'If it shows dead spots, replace the motor complete with its turntable, which is set to the right height at the factory.',
      'Refit and play a full disc.',
    ),
    reading({
      testPoint: 'Spindle motor terminals, disconnected',
      expected: '8-15 Ω, steady as it turns',
      measured: 'open at some positions',
    }),
  ),
  parts: [part('motor', 'KL-9 spindle motor with turntable')],
  difficulty: 'skilled',
  timeMinutes: 60,
  editSummary: 'First write-up.',
  author: 'tech-esme',
  proofer: 'moderator2',
});

const spindleFlex = rev({
  title: 'Disc does not rotate: no drive reaches the spindle motor, cracked joints at the transport connector',
  symptoms: ['disc does not rotate', 'spindle motor not turning', 'focus search then NO DISC'],
  errorCodes: ['NO DISC'],
  cause:
    "The BCD-15's bought-in transport takes its spindle motor drive through a six-way connector soldered to the servo board. The connector is held only by its pins, and every tray movement flexes the board, so the joints crack in a ring. The laser focuses, the controller sees no spindle movement, and it reports an empty tray.",
  body: doc(
    caution(
      'laser',
      'The pickup fires its laser during the focus search with the tray closed and the cover off. Keep your eyes away from the lens while the player is powered.',
    ),
    caution('mains', 'The BCD-15 mains switch and transformer primary sit beside the transport; unplug before soldering.'),
    steps(
      'Unplug the player and remove the top cover.',
      'Look at the six pins of CN201 on the servo board with a magnifier: a fine ring round a pin is a cracked joint.',
      'Measure the spindle motor through the connector while flexing the board gently (reading below).',
      'Remove the old solder from all six pins with braid and resolder them with fresh solder; do the same for the connector anchor tabs.',
      'Check that the spindle turns freely by hand and that the disc table is not rubbing on the chassis.',
      'Power up with a disc: the disc should spin up within two seconds of the tray closing.',
    ),
    reading({
      testPoint: 'Spindle motor terminals, measured at CN201 pins 1 and 2',
      expected: '8-15 Ω, steady',
      measured: 'open, or jumping when the board is flexed',
      note: 'Player unplugged.',
    }),
  ),
  parts: [],
  difficulty: 'careful',
  timeMinutes: 35,
  editSummary: 'First write-up.',
  author: 'tech-farid',
  proofer: 'moderator',
});

export const cdPlayerOpticsFixes: DemoFix[] = [
  {
    slug: 'kl9-skips-dirty-lens',
    machines: ['kestrune/CP-720/multi', 'kestrune/CP-740/multi', 'kestrune/CP-760/multi'],
    chassis: ['kestrune-kl9-transport'],
    revisions: [skipsR1, skipsR2],
  },
  {
    slug: 'kl9-no-disc-f07-worn-laser',
    machines: ['kestrune/CP-720/multi', 'kestrune/CP-740/multi'],
    chassis: ['kestrune-kl9-transport'],
    revisions: [weakLaserR1, weakLaserR2],
  },
  { slug: 'bcd15-stops-later-tracks-sled', machines: ['brindlecote/BCD-15/multi'], chassis: [], revisions: [sled] },
  {
    slug: 'cp720-spindle-will-not-spin-f12',
    machines: ['kestrune/CP-720/multi'],
    chassis: ['kestrune-kl9-transport'],
    revisions: [spindle],
  },
  { slug: 'bcd15-disc-does-not-rotate-spindle-flex', machines: ['brindlecote/BCD-15/multi'], chassis: [], revisions: [spindleFlex] },
];
