// Demo fixes for video cassette recorders: power supply, supply-smoothing and memory backup faults.
import type { DemoFix } from '../types';
import { cap, caution, doc, figure, h, p, part, reading, rev, revise, steps } from './build';

const deadR1 = rev({
  title: 'Completely dead, no clock, fuse intact',
  symptoms: ['no power', 'dead, no standby light', 'clock display blank', 'fuse ok'],
  cause:
    'The TV-5 power supply is a small switch-mode supply. Its controller is started through a high-value resistor and kept running by a small electrolytic on its supply pin. That capacitor sits against the hot primary heatsink, dries out, and the supply can no longer start, so nothing on the secondary side comes up.',
  body: doc(
    caution(
      'mains',
      'The primary side of the TV-5 supply, left of the isolation slot on the board, is at mains potential whenever the lead is in, even in standby.',
    ),
    caution(
      'stored_charge',
      'The reservoir capacitor C801 (47uF 400V) can hold over 300 V for minutes after unplugging. Discharge it through a 2k2 5 W resistor held in insulated clips before you touch the board.',
    ),
    caution('heat', 'The chopper heatsink runs hot; after a bench test give it ten minutes before you handle the board.'),
    steps(
      'Unplug the unit, remove the top cover and discharge C801 as described above; confirm with a meter that it reads under 10 V.',
      'Find C806 (22uF 50V) beside the chopper heatsink. A domed top, a brown ring on the board or a sleeve shrunk back from the top all mark a failed one.',
      'Desolder C806 and test it on an ESR meter: a good one reads under 2 ohms, a failed one tens of ohms or open.',
      'Fit a 105 °C low-ESR replacement of the same value and at least the same voltage, observing polarity (the stripe marks the negative lead).',
      'While the board is out, replace C812 and C813 on the 5 V and 12 V outputs: they live in the same heat.',
      'Power up through a series lamp the first time and check the standby rail.',
    ),
    reading({
      testPoint: '5 V standby rail at C812',
      expected: '5.0 V ± 0.25 V',
      measured: '0 V, or 1-2 V pulsing',
      note: 'Measure to the secondary ground, not to the heatsink.',
    }),
  ),
  parts: [
    cap('C806', '22uF', '50V 105C low-ESR', 'start-up supply, beside the chopper heatsink'),
    cap('C812', '1000uF', '10V 105C low-ESR', '5 V output'),
    cap('C813', '470uF', '25V 105C low-ESR', '12 V output'),
  ],
  difficulty: 'skilled',
  timeMinutes: 60,
  editSummary: 'First write-up.',
  author: 'tech-jonah',
  proofer: 'moderator',
  illustrations: [
    figure(
      'bulging-capacitor',
      'Drawing of an electrolytic capacitor with a domed top standing next to a finned heatsink.',
      'C806 beside the chopper heatsink: a domed top means it has failed.',
    ),
  ],
});

const deadR2 = revise(deadR1, {
  body: doc(
    ...deadR1.body.content,
    h(3, 'If it still will not start'),
    p(
      'Check the start-up resistor R803 with the unit unplugged and C801 discharged. It runs warm for years and drifts open, which gives exactly the same dead unit.',
    ),
    reading({
      testPoint: 'Across R803, unit unplugged',
      expected: '470 kΩ ± 5 %',
      measured: 'open, or several MΩ',
      note: 'Lift one leg to measure; the circuit around it reads low otherwise.',
    }),
  ),
  parts: [...deadR1.parts, part('resistor', '470k', { ref: 'R803', rating: '0.5W', notes: 'start-up resistor; replace if high' })],
  editSummary: 'Added the start-up resistor check for units that stay dead after the capacitor.',
  author: 'moderator',
  proofer: 'moderator2',
});

const deadR3 = revise(deadR2, {
  editSummary: 'Added a drawing of the bleed resistor across C801.',
  author: 'editor',
  proofer: 'moderator2',
  illustrations: [
    ...(deadR2.illustrations ?? []),
    figure(
      'bleed-resistor',
      'Drawing of a resistor in insulated clips bridging the two leads of a large capacitor, with a meter across it.',
      'Discharging C801 through a 2k2 resistor, then measuring it.',
    ),
  ],
});

const dimDisplay = rev({
  title: 'Front display dim and flickering, worse when warm',
  symptoms: ['display dim', 'display flickers', 'clock hard to read', 'worse after an hour'],
  cause:
    'The fluorescent display takes a low filament voltage and a negative grid supply from the power supply. The smoothing capacitor on the negative supply sits beside the 5 V regulator heatsink and loses capacitance, so ripple shows as flicker and the grid voltage sags.',
  body: doc(
    caution(
      'mains',
      'The QM-7 power supply board is live on its primary side; measuring the display supply means working with the lid off and mains connected.',
    ),
    caution(
      'stored_charge',
      'The primary reservoir capacitor keeps a high voltage after unplugging; measure across it before you unsolder anything on the power board.',
    ),
    steps(
      'With the unit running, measure the negative display supply at C831 (reading below).',
      'Unplug, discharge the primary reservoir and confirm it reads under 10 V.',
      'Replace C831 and its neighbour C833 with 105 °C parts, watching polarity: the positive lead of C831 goes to ground on this supply.',
      'Power up and measure again; the display should be even and bright across all digits.',
    ),
    reading({
      testPoint: 'Negative display supply at C831',
      expected: '-27 V ± 2 V, ripple under 0.5 V',
      measured: '-18 V with 3-4 V of ripple',
    }),
  ),
  parts: [
    cap('C831', '100uF', '50V 105C', 'negative display supply, reversed polarity on the board'),
    cap('C833', '47uF', '50V 105C', 'filament supply'),
  ],
  difficulty: 'skilled',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-katya',
  proofer: 'moderator2',
});

const warmBarsR1 = rev({
  title: 'Noise bars roll through the picture after half an hour of play',
  symptoms: ['noise bars after warm-up', 'tracking drifts when warm', 'picture fine when cold'],
  cause:
    "The capstan servo supply is smoothed by a capacitor close to the power supply's 12 V regulator heatsink. As it dries out its ripple rises with temperature and the capstan speed wanders, so the tracking drifts away and noise bars roll through the picture.",
  body: doc(
    caution(
      'mains',
      'This fault only shows when warm, so you measure with the unit open and mains connected. Keep one hand away from the board and use insulated probes.',
    ),
    caution('heat', 'The 12 V regulator heatsink beside C1204 is too hot to touch after half an hour.'),
    steps(
      'Play a tape with the lid off until the bars appear, then measure the ripple at C1204 (reading below).',
      'Unplug and let the board cool. Replace C1204 and C1207 with 105 °C low-ESR parts.',
      'Bend the new C1204 a few millimetres away from the heatsink before soldering, so it no longer touches the fins.',
      'Play for an hour and check that the tracking holds.',
    ),
    reading({
      testPoint: 'Capstan motor supply at C1204',
      expected: '12 V DC, ripple under 50 mV',
      measured: '12 V with about 400 mV ripple once warm',
    }),
  ),
  parts: [
    cap('C1204', '220uF', '16V 105C low-ESR', 'capstan supply, next to the 12 V regulator'),
    cap('C1207', '10uF', '50V 105C', 'servo reference'),
  ],
  difficulty: 'skilled',
  timeMinutes: 50,
  editSummary: 'First write-up.',
  author: 'tech-esme',
  proofer: 'moderator',
});

const warmBarsR2 = revise(warmBarsR1, {
  body: doc(
    ...warmBarsR1.body.content.slice(0, 2),
    p(
      'To confirm before soldering, warm C1204 alone with a hair dryer on low while the tape plays cold: if the bars appear within a minute, it is the culprit.',
    ),
    ...warmBarsR1.body.content.slice(2),
  ),
  editSummary: 'Added a quick hair-dryer check to confirm the capacitor before replacing it.',
  author: 'tech-ilse',
  proofer: 'moderator2',
});

const dryJointsR1 = rev({
  title: 'Intermittent shutdown: dry joints on the regulator and transformer pins',
  symptoms: ['intermittent shutdown', 'drops to standby at random', 'fault comes and goes', 'tap test brings it on'],
  cause:
    'The QM-7 power board carries its regulators and the mains transformer on one single-sided board, and their heavy pins move a little with every warm-up. After years the solder round them cracks in a ring, the contact makes and breaks with heat and vibration, and any dip on the 5 V rail resets the controller to standby.',
  body: doc(
    caution(
      'mains',
      'The transformer primary pins and the fuse on the QM-7 power board are at mains voltage when the recorder is plugged in. Do the tap test only with the recorder on an isolating transformer, and use an insulated rod, never a metal tool or a finger.',
    ),
    caution('heat', 'The regulator heatsinks are hot after a warm-up run; let them cool before you solder next to them.'),
    steps(
      'Remove the top cover and run the recorder on an isolating transformer until it is warm.',
      'Tap round the power board with an insulated rod while watching the 5 V rail (reading below); note where a tap makes it drop.',
      'Unplug the recorder and let the heatsinks cool.',
      'Remove the old solder from every regulator, transformer and connector pin on the power board with braid, and resolder each with fresh solder.',
      'Repeat the tap test: the rail should not move and the recorder should stay on.',
    ),
    reading({
      testPoint: '5 V rail at the regulator output, during the tap test',
      expected: '4.9-5.1 V, steady',
      measured: 'drops to 0 V for a moment when the transformer is tapped',
    }),
  ),
  parts: [],
  difficulty: 'careful',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-hugo',
  proofer: 'moderator',
});

const dryJointsR2 = revise(dryJointsR1, {
  body: doc(
    ...dryJointsR1.body.content,
    p(
      'If the fault survives the resoldering, look at the ribbon from the power board to the main board: its end connector can crack the same way and gives the same shutdown.',
    ),
  ),
  editSummary: 'Added the ribbon connector as the next place to look.',
  author: 'tech-lucan',
  proofer: 'moderator2',
});

const backupCap = rev({
  title: 'Clock and presets lost whenever it is unplugged: memory backup capacitor',
  symptoms: ['clock resets after a power cut', 'tuner presets lost', 'timer recordings forgotten'],
  cause:
    "The QM-7 recorders keep the clock and the tuner presets in the controller's own memory, held up by a 0.1 F backup capacitor while the mains is off. After twenty years its capacitance has fallen and its leakage risen, so it holds the memory for seconds rather than days. The S-VHS model mounts it beside the warm 5 V regulator, which ages it sooner.",
  body: doc(
    caution('mains', 'The backup capacitor sits near the fuse on the power board, which is at mains voltage. Unplug before working.'),
    steps(
      'Set the clock, then measure the backup capacitor and unplug the recorder (reading below).',
      'Remove the top cover and find C951, the flat coin-shaped capacitor next to the 5 V regulator.',
      'Replace it with a 0.1 F 5.5 V memory backup capacitor, observing the polarity marked on the board.',
      'Plug in for an hour to charge it, set the clock and tune the channels, then leave the recorder unplugged overnight: the clock should still be right in the morning.',
    ),
    reading({
      testPoint: 'Across C951, ten minutes after unplugging',
      expected: 'above 3 V',
      measured: 'under 0.5 V',
      note: 'Charged for an hour first.',
    }),
  ),
  parts: [cap('C951', '0.1F', '5.5V', 'memory backup, coin type')],
  difficulty: 'routine',
  timeMinutes: 30,
  editSummary: 'First write-up.',
  author: 'tech-ilse',
  proofer: 'moderator',
});

export const vcrPowerFixes: DemoFix[] = [
  {
    slug: 'tv5-dead-no-clock-startup-capacitor',
    machines: ['tamberlyn/TV-820/PAL', 'tamberlyn/TV-825K/PAL', 'tamberlyn/TV-825K/NTSC'],
    chassis: ['tamberlyn-tv5-deck'],
    revisions: [deadR1, deadR2, deadR3],
  },
  {
    slug: 'qm7-display-dim-flickering',
    machines: ['quillmere/VR-3150S/PAL', 'quillmere/VR-3100/PAL'],
    chassis: ['quillmere-qm7-deck'],
    revisions: [dimDisplay],
  },
  { slug: 'qm7-noise-bars-after-warm-up', machines: ['quillmere/VR-3150S/PAL'], chassis: [], revisions: [warmBarsR1, warmBarsR2] },
  {
    slug: 'vr3100-cuts-out-intermittently-dry-joints',
    machines: ['quillmere/VR-3100/PAL', 'quillmere/VR-3100/NTSC'],
    chassis: [],
    revisions: [dryJointsR1, dryJointsR2],
  },
  {
    slug: 'qm7-forgets-clock-backup-capacitor',
    machines: ['quillmere/VR-3150S/PAL', 'quillmere/VR-3100/PAL'],
    chassis: ['quillmere-qm7-deck'],
    revisions: [backupCap],
  },
];
