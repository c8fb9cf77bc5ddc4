// Demo fixes for cassette decks: belts, idlers, pinch rollers and speed.
import type { DemoFix } from '../types';
import { caution, doc, figure, h, p, part, reading, rev, revise, steps } from './build';

const wowR1 = rev({
  title: 'Wow and flutter: sustained notes waver',
  symptoms: ['wow and flutter', 'pitch wobbles', 'piano sounds seasick', 'speed wavers'],
  cause:
    'The BT-4 drives its capstan flywheel from the motor through a flat belt. As the belt ages it stretches unevenly and its surface glazes, so it slips a little on every turn and the tape speed wavers.',
  body: doc(
    p(
      'Unplug the deck. Listen to a piano recording first: a slow waver (wow) points to the belt; a fast rough warble (flutter) points to the pinch roller or a dirty capstan.',
    ),
    steps(
      'Remove the top cover (four screws) and the transport (three screws under the front).',
      'Remove the flywheel retaining plate at the back of the transport and lift off the old belt.',
      'Clean the motor pulley and the flywheel rim with isopropyl alcohol until no black comes off.',
      'Fit the new belt with its matt side against the pulleys, without twisting it.',
      'Clean the capstan shaft and the pinch roller, refit the transport and play a test recording.',
    ),
  ),
  parts: [part('belt', 'flat belt 120 mm inside circumference x 5 mm x 0.5 mm', { notes: 'BT-4 capstan belt' })],
  difficulty: 'careful',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-nils',
  proofer: 'moderator',
});

const wowR2 = revise(wowR1, {
  body: doc(
    ...wowR1.body.content,
    h(3, 'Measure it'),
    p("Play a 3150 Hz test tape into a wow and flutter meter, weighted as the meter's standard setting prescribes."),
    reading({
      testPoint: 'Line out, 3150 Hz test tape',
      expected: 'under 0.10 % weighted',
      measured: '0.3 % or more with a slow swing',
      note: 'A deck that reads well at the start of a tape but worse at the end has a weak take-up, not a bad belt.',
    }),
  ),
  editSummary: 'Added a wow and flutter reading with a test tape.',
  author: 'tech-farid',
  proofer: 'moderator2',
});

const speedDrift = rev({
  title: 'Speed drifts: tapes play fast or slow, worse over time',
  symptoms: ['plays too fast', 'plays too slow', 'speed drift', 'pitch changes as the deck warms'],
  cause:
    "The BT-4 motor holds its speed with a small electronic governor and a trimmer reached through a hole in the motor can. The trimmer track gets dirty and the governor's timing capacitor drifts with heat, so the speed wanders as the deck warms up.",
  body: doc(
    p('Let the deck run for fifteen minutes before adjusting, so the motor is at working temperature.'),
    caution(
      'mains',
      'The BT-4 mains transformer and power switch sit beside the motor, and their terminals are exposed while you adjust with the cover off. Use an insulated trimming tool and keep your other hand clear.',
    ),
    steps(
      'Remove the top cover. The speed trimmer is behind the small hole in the back of the motor can.',
      'Play a 3150 Hz test tape and read the output frequency on a counter.',
      'Turn the trimmer with an insulated trimming tool, a few degrees at a time, until the reading is on target.',
      'If the reading jumps as you turn it, the trimmer is dirty: work it end to end a few times and adjust again.',
      'Check again after another thirty minutes.',
    ),
    reading({ testPoint: 'Line out, 3150 Hz test tape', expected: '3150 Hz ± 15 Hz (0.5 %)', measured: 'drifting 3050-3250 Hz' }),
  ),
  difficulty: 'skilled',
  timeMinutes: 40,
  editSummary: 'First write-up.',
  author: 'tech-greta',
  proofer: 'moderator2',
});

const idlerDeck = rev({
  title: 'Play starts then stops, take-up spool not turning',
  symptoms: ['play stops after a second', 'take-up not turning', 'auto-stop on play', 'no fast forward'],
  cause:
    'The KT-44 uses one motor for everything, and a small rubber-tyred idler swings across to drive the take-up spool. The tyre hardens and glazes; the take-up stalls, and the auto-stop sensor sees no rotation and stops the deck.',
  body: doc(
    p('Unplug the deck and remove the cassette door and the top cover.'),
    steps(
      'Remove the transport (four screws) and find the idler between the spool hubs.',
      'Lift off the idler after removing its clip; check the tyre with a fingernail.',
      'Fit a new tyre, clean the spool hub rims and refit.',
      'Test play, fast forward and rewind with a C90 cassette.',
    ),
  ),
  parts: [part('idler_tyre', '14 mm OD x 2 mm section', { notes: 'KT-44 take-up idler' })],
  difficulty: 'careful',
  timeMinutes: 40,
  editSummary: 'First write-up.',
  author: 'tech-katya',
  proofer: 'moderator',
});

const creaseR1 = rev({
  title: 'Creases tape: the edge comes out crinkled',
  symptoms: ['creases tape', 'crinkled tape edge', 'tape climbs the capstan', 'muffled sound on one channel'],
  cause:
    'A hard, glossy pinch roller no longer presses evenly on the capstan. The tape rides up or down the shaft and its edge folds against the guides, which also spoils the treble on the edge track.',
  body: doc(
    p('Unplug the deck and open the cassette door.'),
    steps(
      'Push the head block forward by hand to bring the pinch roller against the capstan and watch where they meet.',
      'Check the roller: it should be matt and slightly soft, and its shaft should not wobble.',
      "Remove the roller's retaining clip and fit a new roller of the same diameter and width.",
      'Clean the capstan and guides, then play a scrap tape and check its edge.',
    ),
  ),
  parts: [part('pinch_roller', '10 mm diameter x 6 mm wide, 2 mm bore', { notes: 'BT-4 pinch roller' })],
  difficulty: 'careful',
  timeMinutes: 30,
  editSummary: 'First write-up.',
  author: 'tech-dmitri',
  proofer: 'moderator2',
});

const creaseR2 = revise(creaseR1, {
  body: doc(
    ...creaseR1.body.content,
    p(
      'On the TD-590 the three-head block also has tape guides of its own: check that both guide forks are straight, or the new roller will crease tape as well.',
    ),
  ),
  editSummary: 'Added the guide fork check on the three-head model.',
  author: 'editor',
  proofer: 'moderator',
  illustrations: [
    figure(
      'pinch-roller',
      'Drawing of a pinch roller pressing tape against a capstan shaft.',
      'The pinch roller must meet the capstan square along its whole width.',
    ),
  ],
});

export const cassetteDeckTransportFixes: DemoFix[] = [
  {
    slug: 'bt4-wow-and-flutter-capstan-belt',
    machines: ['brindlecote/TD-550/multi', 'brindlecote/TD-570R/multi', 'brindlecote/TD-590/multi'],
    chassis: ['brindlecote-bt4-transport'],
    revisions: [wowR1, wowR2],
  },
  {
    slug: 'bt4-speed-drift-motor-trimmer',
    machines: ['brindlecote/TD-550/multi', 'brindlecote/TD-590/multi'],
    chassis: ['brindlecote-bt4-transport'],
    revisions: [speedDrift],
  },
  { slug: 'kt44-play-stops-idler-tyre', machines: ['kestrune/KT-44/multi'], chassis: [], revisions: [idlerDeck] },
  {
    slug: 'bt4-creases-tape-pinch-roller',
    machines: ['brindlecote/TD-590/multi', 'brindlecote/TD-550/multi'],
    chassis: ['brindlecote-bt4-transport'],
    revisions: [creaseR1, creaseR2],
  },
];
