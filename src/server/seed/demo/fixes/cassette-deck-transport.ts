// Demo fixes for cassette decks: belts, idlers, pinch rollers, bearings and speed.
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

const reverseSpill = rev({
  title: 'Spills tape at auto-reverse: the forward pinch roller lifts late',
  symptoms: ['spills tape on reverse', 'tape caught on the reverse capstan', 'chews tape at changeover'],
  cause:
    'The TD-570R has two capstans and two pinch rollers, and at the end of a side a solenoid-driven changeover cam swaps which roller presses. The grease on the cam hardens and the forward roller lifts late, so for a moment both capstans pull against each other and the slack is wound round the reverse capstan. A glazed reverse roller makes it worse.',
  body: doc(
    caution(
      'spring',
      'The pinch roller arm return springs are small and strong; they fly off when unhooked. Wear eye protection and hold each spring with tweezers as you release it.',
    ),
    steps(
      'Unplug the deck, remove the cassette door and the head block cover.',
      'Work the changeover cam by hand through a full cycle: it should move freely and snap over under its spring.',
      'Clean the old grease from the cam and its slider with isopropyl alcohol and apply a little light plastic-safe grease.',
      'Clean both pinch rollers with rubber cleaner; replace the reverse roller if it stays glossy or shows a groove.',
      'With a tape you do not mind losing, play to the end of a side ten times in each direction and watch the changeover.',
    ),
    reading({
      testPoint: 'Changeover, forward roller lift against reverse roller press',
      expected: 'forward roller lifts first, reverse roller presses within 100 ms',
      measured: 'both rollers pressing together for about 300 ms',
      note: 'Watch through the open head block with a slow-motion phone video.',
    }),
  ),
  parts: [part('pinch_roller', 'pinch roller 10 mm diameter, 7 mm wide', { notes: 'reverse side' })],
  difficulty: 'careful',
  timeMinutes: 50,
  editSummary: 'First write-up.',
  author: 'tech-nils',
  proofer: 'moderator2',
  illustrations: [
    figure(
      'pinch-roller',
      'Drawing of a rubber roller pressing a tape against a thin steel shaft.',
      'Only one of the two rollers may press at any moment; watch both during the changeover.',
    ),
  ],
});

const capstanBearing = rev({
  title: 'Capstan squeal in play: dry capstan bearing',
  symptoms: ['capstan squeal', 'squealing in play and fast wind', 'noise stops when the flywheel is touched'],
  cause:
    'The KT-44 capstan runs in a sintered bronze bearing that holds a little oil in its pores. After years the oil is gone, the shaft runs metal on metal and squeals at play speed, and the extra drag can slow the tape. Left alone the shaft scores and the bearing has to be replaced with it.',
  body: doc(
    caution(
      'spring',
      'The E-clip that holds the flywheel springs away when it is levered off. Wear eye protection and cover the clip with a finger as it comes free.',
    ),
    steps(
      'Unplug the deck and remove the bottom cover and the flywheel retaining plate.',
      'Lift the belt off the flywheel, lever off the E-clip and draw the flywheel and capstan out from the front.',
      'Clean the shaft with isopropyl alcohol and look at it against a light: a dull band or score marks mean a new flywheel and bearing.',
      'Put one drop of light synthetic oil on the shaft and one on the bearing; no more, and none on the capstan face that meets the tape.',
      'Refit the flywheel, the clip and the belt, and check that the shaft has a little end float.',
      'Play a tape for ten minutes: the squeal should not return, and the speed should be as before.',
    ),
  ),
  parts: [
    part('mechanical', 'E-clip 2.3 mm', { notes: 'spare, they are easily lost' }),
    part('other', 'light synthetic oil for sintered bearings'),
  ],
  difficulty: 'careful',
  timeMinutes: 40,
  editSummary: 'First write-up.',
  author: 'tech-oona',
  proofer: 'moderator2',
  illustrations: [
    figure(
      'belt-path',
      'Drawing of a belt running from a small motor pulley round a large flywheel.',
      'The flywheel comes out once the belt is off and the clip is removed.',
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
  {
    slug: 'td570r-eats-tape-on-reverse-pinch-roller',
    machines: ['brindlecote/TD-570R/multi'],
    chassis: [],
    revisions: [reverseSpill],
  },
  { slug: 'kt44-squeal-capstan-bearing', machines: ['kestrune/KT-44/multi'], chassis: [], revisions: [capstanBearing] },
];
