// Demo fixes for DVD recorders: power supply and cooling faults.
import type { DemoFix } from '../types';
import { cap, caution, doc, figure, p, part, reading, rev, revise, steps } from './build';

const slowStartR1 = rev({
  title: 'Slow to start: stuck on WAKING for minutes, then works',
  symptoms: ['slow start-up', 'stuck on WAKING', 'takes ages to turn on', 'works once warm'],
  cause:
    'The TL-2 recorders use one switch-mode board whose output capacitors stand in a row beside the secondary rectifier heatsink. As they dry out, the 3.3 V and 5 V rails carry so much ripple that the main processor resets over and over. Once the capacitors warm up their ESR falls and the recorder starts.',
  body: doc(
    caution(
      'mains',
      'The left third of the TL-2 power board is at mains potential. Unplug before touching anything; the board has no cover of its own.',
    ),
    caution(
      'stored_charge',
      'The primary reservoir capacitor (82uF 400V) keeps its charge after unplugging. Measure it and discharge it through a 2k2 5 W resistor if it reads over 10 V.',
    ),
    caution('heat', 'The secondary rectifier heatsink beside the capacitors is hot after a bench run.'),
    steps(
      'Unplug the recorder, remove the top cover and check the primary reservoir as described above.',
      "Unplug the power board's output connector and remove its four screws.",
      'Replace C905, C906, C908 and C910 beside the heatsink with 105 °C low-ESR parts of the same value and at least the same voltage.',
      'Keep the new parts the same height, standing off the board by 2 mm, so they do not touch the heatsink.',
      'Refit the board and time the start: WAKING should clear in under 15 seconds.',
    ),
  ),
  parts: [
    cap('C905', '1000uF', '10V 105C low-ESR', '3.3 V rail', 1),
    cap('C906', '1000uF', '10V 105C low-ESR', '5 V rail', 1),
    cap('C908', '470uF', '16V 105C low-ESR', '12 V rail'),
    cap('C910', '220uF', '25V 105C low-ESR', 'tuner 30 V feed'),
  ],
  difficulty: 'skilled',
  timeMinutes: 60,
  editSummary: 'First write-up.',
  author: 'tech-jonah',
  proofer: 'moderator',
});

const slowStartR2 = revise(slowStartR1, {
  body: doc(
    ...slowStartR1.body.content,
    p('To confirm the diagnosis before opening the supply, measure the 3.3 V rail with an oscilloscope during the WAKING loop:'),
    reading({
      testPoint: '3.3 V rail at C905',
      expected: '3.3 V, ripple under 50 mV',
      measured: '2.9-3.4 V swinging, ripple 300 mV or more',
      note: 'Measure cold, straight after switching on.',
    }),
    reading({ testPoint: 'ESR of C905 out of circuit', expected: 'under 0.1 Ω', measured: '1-3 Ω' }),
  ),
  editSummary: 'Added ripple and ESR readings so the fault can be confirmed before desoldering.',
  author: 'moderator2',
  proofer: 'moderator',
  illustrations: [
    figure(
      'bulging-capacitor',
      'Drawing of a capacitor with a domed top next to a finned heatsink.',
      'C905 and C906 stand right beside the rectifier heatsink.',
    ),
  ],
});

const clicking = rev({
  title: 'Power supply clicks or ticks, no power',
  symptoms: ['clicking from power supply', 'ticking noise, no display', 'no power'],
  cause:
    'A ticking supply is starting, seeing an overload and shutting down, over and over. On the KD-560 the usual overload is a shorted Schottky rectifier on the 5 V output, often after its smoothing capacitor dried out and let it run hot.',
  body: doc(
    caution(
      'mains',
      'The KD-560 power board sits at the rear beside the mains inlet, with its primary side uncovered. Work on it unplugged only.',
    ),
    caution(
      'stored_charge',
      'A ticking supply may not drain its reservoir capacitor: it can hold a high voltage for a long time. Measure across it and discharge it through a 2k2 5 W resistor before working.',
    ),
    steps(
      'Unplug, open the cover and discharge the reservoir capacitor as above.',
      'Test D902 (the 5 V rectifier on the small heatsink) in diode-test mode (reading below).',
      'If it is shorted, desolder it and test again out of circuit to be sure.',
      'Fit a new rectifier of the same type and rating, and replace C912 beside it.',
      'Power up through a series lamp: the lamp should flash once and go dim, and the display should light.',
    ),
    reading({
      testPoint: 'Across D902, diode-test mode, unit unplugged',
      expected: '0.2-0.4 V one way, open the other',
      measured: 'near 0 V both ways (shorted)',
    }),
  ),
  parts: [
    part('diode', 'Schottky rectifier 5 A 40 V', { ref: 'D902', rating: 'DO-201 axial' }),
    cap('C912', '2200uF', '10V 105C low-ESR', '5 V output'),
  ],
  difficulty: 'skilled',
  timeMinutes: 50,
  editSummary: 'First write-up.',
  author: 'tech-katya',
  proofer: 'moderator2',
});

const fanR1 = rev({
  title: 'Stops recording after twenty minutes with F-31, fan silent',
  symptoms: ['error after warm-up', 'stops recording after 20 minutes', 'fan not spinning', 'top cover very hot'],
  errorCodes: ['F-31'],
  cause:
    'The KD-560 cools its drive and power board with one small fan at the rear. Its sleeve bearing dries out and the fan stalls; the drive temperature sensor then stops recording with F-31 once the inside passes its limit.',
  body: doc(
    caution(
      'heat',
      'After an F-31 shutdown the drive and the power board heatsink are hot. Leave the recorder unplugged for fifteen minutes before opening it.',
    ),
    steps(
      'Unplug the recorder and remove the top cover.',
      'Spin the fan with a fingertip: it should coast for a second or two. A stiff fan that stops at once has a dry bearing.',
      'Unplug the fan from the board, remove its two screws and lift it out.',
      'Fit a new fan of the same size and voltage, blowing outwards.',
      'Clean dust off the drive and the heatsink with a soft brush and a vacuum nozzle held away from the board.',
      'Record for two hours; F-31 should not return.',
    ),
  ),
  parts: [part('other', 'fan 40 mm x 10 mm, 12 V DC, 2-wire', { notes: 'blows outwards through the rear panel' })],
  difficulty: 'routine',
  timeMinutes: 30,
  editSummary: 'First write-up.',
  author: 'tech-mina',
  proofer: 'moderator',
});

const fanR2 = revise(fanR1, {
  cause:
    'The KD-560 cools its drive and power board with one small fan at the rear. Its sleeve bearing dries out and the fan stalls; the drive temperature sensor then stops recording with F-31 once the inside passes its limit. A fan fitted blowing inwards gives the same fault, because the hot air then circulates inside.',
  editSummary: 'Noted that a fan fitted the wrong way round gives the same error.',
  author: 'tech-oona',
  proofer: 'moderator2',
});

export const dvdRecorderPowerFixes: DemoFix[] = [
  {
    slug: 'tl2-slow-start-stuck-on-waking',
    machines: ['tamberlyn/DR-4120/PAL', 'tamberlyn/DR-4120/NTSC', 'tamberlyn/DR-4120K/PAL'],
    chassis: ['tamberlyn-tl2-loader'],
    revisions: [slowStartR1, slowStartR2],
  },
  { slug: 'kd560-clicking-supply-no-power', machines: ['kestrune/KD-560/PAL'], chassis: [], revisions: [clicking] },
  { slug: 'kd560-f31-fan-stalled', machines: ['kestrune/KD-560/PAL'], chassis: [], revisions: [fanR1, fanR2] },
];
