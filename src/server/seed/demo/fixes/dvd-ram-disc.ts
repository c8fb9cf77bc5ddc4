// Demo fixes for DVD-RAM recorders: pickup, tray and cartridge faults.
import type { DemoFix } from '../types';
import { caution, doc, figure, p, part, reading, rev, revise, steps } from './build';

const ldErr = rev({
  title: 'LD ERR 3 at switch-on, tray works normally',
  symptoms: ['LD ERR 3 on display', 'no disc with any disc', 'disc spins briefly then stops'],
  errorCodes: ['LD ERR 3'],
  cause:
    "LD ERR 3 is the ORX-5 code for a laser drive current above its limit. As the pickup's laser diode ages it needs more current for the same light, until the drive hits its ceiling during the start-up check. Cleaning will not clear it; the pickup needs replacing.",
  body: doc(
    caution(
      'laser',
      'The ORX-5 pickup is a recording unit with an invisible infrared beam besides the red one. Keep the pickup covered whenever the drive is powered outside the case.',
    ),
    p('Measure the laser current before you order a pickup: a low reading points elsewhere.'),
    reading({
      testPoint: 'Across the 10 Ω sense resistor R612 on the drive board',
      expected: '0.35-0.50 V (35-50 mA) while focusing',
      measured: 'over 0.60 V, then LD ERR 3',
      note: 'The reading lasts only a few seconds before the drive gives up; use a meter with hold.',
    }),
    steps(
      'Unplug the recorder, wear an earthed wrist strap and remove the drive (four screws, two cables).',
      'Release the sled guide rod and lift the pickup off its worm gear.',
      'Fit the new pickup, plug in its flex and only then remove the solder short that protects the diode.',
      'Refit the drive and run the start-up check; a DVD-RAM disc should be recognised within 20 seconds.',
    ),
  ),
  parts: [part('optical_pickup', 'ORX-5 recording pickup', { notes: 'remove the solder short only after the flex is plugged in' })],
  difficulty: 'specialist',
  timeMinutes: 100,
  editSummary: 'First write-up.',
  author: 'tech-dmitri',
  proofer: 'moderator',
});

const cartridgeR1 = rev({
  title: 'Will not accept a disc in its cartridge, bare discs fine',
  symptoms: ['cartridge rejected', 'ejects cartridge straight away', 'bare discs play fine'],
  cause:
    'A leaf switch at the back of the tray tells the controller a cartridge is present, and a second one reads its write-protect tab. The contacts tarnish and the leaves lose their spring, so the controller thinks the tray holds something it cannot use and ejects it.',
  body: doc(
    p('Unplug the recorder, then open the tray by hand: a small white wheel under the front of the drive turns the tray out.'),
    steps(
      'Remove the tray: two stop latches at the rear of its rails.',
      'Find the two leaf switches at the back corner of the tray bed.',
      'Slip a strip of paper wetted with contact cleaner between each pair of contacts and draw it through, pressing the leaves together lightly.',
      'If a leaf no longer closes when a cartridge is pushed against it, bend it back towards its partner by half a millimetre.',
      'Refit the tray and test with a cartridge, with its write-protect tab set each way.',
    ),
  ),
  parts: [],
  difficulty: 'careful',
  timeMinutes: 40,
  editSummary: 'First write-up.',
  author: 'tech-greta',
  proofer: 'moderator2',
});

const cartridgeR2 = revise(cartridgeR1, {
  body: doc(
    ...cartridgeR1.body.content,
    reading({
      testPoint: 'Cartridge-present switch, cartridge pushed home',
      expected: 'under 1 Ω',
      measured: 'open, or hundreds of ohms that flicker',
      note: 'Measure with the tray out and the recorder unplugged.',
    }),
  ),
  editSummary: 'Added a continuity reading for the cartridge switch.',
  author: 'tech-ilse',
  proofer: 'moderator',
});

const trayCloseR1 = rev({
  title: 'Tray will not close, comes back out with LD ERR 1',
  symptoms: ["tray won't close", 'tray comes back out', 'LD ERR 1 on display'],
  errorCodes: ['LD ERR 1'],
  cause:
    'LD ERR 1 means the tray did not reach its closed switch. On the ORX-5 the grease on the tray rack turns to glue after years of warm air, and the small loading belt no longer has grip enough to pull the tray through it.',
  body: doc(
    p('Unplug the recorder and remove the top cover and the drive.'),
    steps(
      'Turn the tray out with the white wheel under the drive and lift it off its rails.',
      'Wipe the old grease off the rack and rails with isopropyl alcohol until they are clean and dry.',
      'Apply a thin film of light plastic-safe grease to the rack and the rail edges only.',
      'Replace the loading belt and clean the pulley grooves.',
      'Refit and run open and close twenty times with a cartridge and with a bare disc.',
    ),
  ),
  parts: [part('belt', 'square belt 1.0 mm section, 26 mm inside diameter', { notes: 'ORX-5 loading belt' })],
  difficulty: 'careful',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-celia',
  proofer: 'moderator',
  illustrations: [
    figure('tray-gear', 'Drawing of a tray rack meshing with a loading gear, with timing marks.', 'ORX-5 tray rack and its loading gear.'),
  ],
});

const trayCloseR2 = revise(trayCloseR1, {
  body: doc(
    ...trayCloseR1.body.content.slice(0, 1),
    steps(
      'Turn the tray out with the white wheel under the drive and lift it off its rails.',
      'Wipe the old grease off the rack and rails with isopropyl alcohol until they are clean and dry.',
      'Apply a thin film of light plastic-safe grease to the rack and the rail edges only; grease on the belt path makes the new belt slip.',
      'Replace the loading belt and clean the pulley grooves.',
      'Before refitting the tray, line up the arrow on the loading gear with the notch in the frame so the tray meets the first tooth.',
      'Refit and run open and close twenty times with a cartridge and with a bare disc.',
    ),
  ),
  editSummary: 'Added the gear timing step before refitting the tray, and where not to put grease.',
  author: 'editor',
  proofer: 'moderator2',
});

const skips = rev({
  title: 'DVD-RAM recordings freeze and skip on playback',
  symptoms: ['skips on playback', 'picture freezes', 'RAM discs worse than DVD-R'],
  cause:
    "The ORX-5 draws its cooling air past the drive, and over the years dust settles on the pickup lens. DVD-RAM's fine sector headers are the first thing a dirty lens misreads, so RAM playback stutters before anything else fails.",
  body: doc(
    caution('laser', 'Clean the ORX-5 lens only with the recorder unplugged; its pickup has an infrared beam you cannot see.'),
    steps(
      'Unplug the recorder, remove the top cover and slide the drive lid off (two clips).',
      'Blow loose dust off the lens with a bulb blower, then wipe once with a lens swab and isopropyl alcohol, from the centre outwards.',
      'Clean the dust filter behind the front panel, or the lens will be dirty again within months.',
      'Play a RAM recording through from start to end.',
    ),
  ),
  difficulty: 'routine',
  timeMinutes: 25,
  editSummary: 'First write-up.',
  author: 'tech-farid',
  proofer: 'moderator2',
});

export const dvdRamDiscFixes: DemoFix[] = [
  {
    slug: 'orx5-ld-err-3-laser-current',
    machines: ['orvalle/RX-710/PAL', 'orvalle/RX-710/NTSC', 'orvalle/RX-760H/PAL'],
    chassis: ['orvalle-orx5-platform'],
    revisions: [ldErr],
  },
  {
    slug: 'orx5-cartridge-rejected',
    machines: ['orvalle/RX-710/PAL', 'orvalle/RX-710/NTSC'],
    chassis: ['orvalle-orx5-platform'],
    revisions: [cartridgeR1, cartridgeR2],
  },
  {
    slug: 'orx5-tray-will-not-close-ld-err-1',
    machines: ['orvalle/RX-760H/PAL'],
    chassis: ['orvalle-orx5-platform'],
    revisions: [trayCloseR1, trayCloseR2],
  },
  { slug: 'orx5-ram-playback-skips', machines: ['orvalle/RX-710/PAL', 'orvalle/RX-760H/PAL'], chassis: [], revisions: [skips] },
];
