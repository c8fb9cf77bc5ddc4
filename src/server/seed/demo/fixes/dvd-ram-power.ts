// Demo fixes for DVD-RAM recorders: standby, main power supply and hard disc start-up faults.
import type { DemoFix } from '../types';
import { cap, caution, doc, h, p, part, reading, rev, revise, steps } from './build';

const standbyR1 = rev({
  title: 'No power at all, standby light off',
  symptoms: ['no power', 'standby light off', 'dead', 'relay does not click'],
  cause:
    "The ORX-5 keeps a small separate standby supply running whenever it is plugged in. Its output capacitor stands under the main heatsink's fan outlet, dries out from years of warm air, and the standby supply collapses, so the recorder never hears the power button.",
  body: doc(
    caution(
      'mains',
      'The standby supply is live whenever the ORX-5 is plugged in, even with the display dark. Its primary side shares the board edge with the mains inlet.',
    ),
    caution(
      'stored_charge',
      'The standby supply has its own small reservoir capacitor (10uF 400V) besides the main one; measure both before you touch the board.',
    ),
    steps(
      'Unplug the recorder and wait two minutes, then remove the top cover.',
      'Measure both reservoir capacitors; discharge any reading over 10 V through a 2k2 5 W resistor.',
      "Replace C1503 (the standby output capacitor) and C1501 on the standby chip's supply pin.",
      'Plug in and check the standby rail (reading below) before pressing the power button.',
    ),
    reading({ testPoint: 'Standby 5 V at C1503', expected: '5.1 V ± 0.2 V', measured: '0 V, or a 1-3 V sawtooth' }),
  ),
  parts: [cap('C1503', '470uF', '10V 105C low-ESR', 'standby output'), cap('C1501', '47uF', '35V 105C', 'standby chip supply')],
  difficulty: 'skilled',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-lucan',
  proofer: 'moderator',
});

const standbyR2 = revise(standbyR1, {
  parts: [
    ...standbyR1.parts,
    part('fuse', 'T500mA', { ref: 'F1502', rating: '250V, 5 x 20 mm', notes: 'standby fuse; check, often open after the capacitor fails' }),
  ],
  body: doc(
    ...standbyR1.body.content,
    p('If the standby rail stays at 0 V, check the standby fuse F1502; it often opens when C1501 fails.'),
  ),
  editSummary: 'Added the standby fuse, which often opens along with the capacitor.',
  author: 'tech-nils',
  proofer: 'moderator2',
});

const warmShutdownR1 = rev({
  title: 'Switches itself off after an hour, will not restart until cool',
  symptoms: ['switches off when warm', 'clicks off after an hour', 'restarts only when cold'],
  cause:
    'The main supply on the ORX-5 protects itself when its outputs sag under load. The 12 V and 5 V output capacitors beside the rectifier heatsink lose capacitance with heat; once warm their ripple trips the protection, and it holds off until the board cools.',
  body: doc(
    caution(
      'mains',
      'Confirming this fault means running the ORX-5 warm with the cover off; the primary side of the main supply is exposed beside the fan.',
    ),
    caution(
      'stored_charge',
      'The main reservoir capacitor (100uF 400V) can stay charged for several minutes after the recorder trips out.',
    ),
    caution('heat', 'The rectifier heatsink and the capacitors beside it are too hot to touch by the time the fault shows.'),
    steps(
      'Check the cooling fan first: a stalled fan gives the same shut-down. It should spin as soon as the recorder starts.',
      'Unplug, wait for the heatsink to cool and discharge the main reservoir.',
      'Replace C1411, C1412 and C1415 with 105 °C low-ESR parts; check the ESR of the old ones to confirm.',
      'Run the recorder for two hours with a recording in progress.',
    ),
    reading({
      testPoint: '12 V output at C1411, after an hour',
      expected: '12 V, ripple under 100 mV',
      measured: '11.2 V with 600 mV ripple, then shutdown',
    }),
  ),
  parts: [
    cap('C1411', '1000uF', '16V 105C low-ESR', '12 V output'),
    cap('C1412', '1000uF', '16V 105C low-ESR', '12 V output, second'),
    cap('C1415', '1500uF', '10V 105C low-ESR', '5 V output'),
  ],
  difficulty: 'skilled',
  timeMinutes: 70,
  editSummary: 'First write-up.',
  author: 'tech-ansel',
  proofer: 'moderator2',
});

const warmShutdownR2 = revise(warmShutdownR1, {
  body: doc(
    ...warmShutdownR1.body.content,
    h(3, 'RX-760H only'),
    p('The hard-disc models also feed the disc from the 12 V rail, so replace C1416 beside the disc connector at the same time.'),
  ),
  parts: [...warmShutdownR1.parts, cap('C1416', '470uF', '16V 105C low-ESR', 'hard-disc 12 V feed, RX-760H only')],
  editSummary: 'Added the extra capacitor on the hard-disc models.',
  author: 'moderator',
  proofer: 'moderator2',
});

const hardDiscStartR1 = rev({
  title: 'Slow start-up on the hard disc model: the drive retries before the clock appears',
  symptoms: ['slow start-up', 'HDD spins up again and again', 'clock shows only after several minutes'],
  cause:
    'The RX-760H will not finish its start-up until its internal hard disc reports ready. The drive takes its 12 V from the main supply through a small filter capacitor on the drive adaptor board, and as that capacitor dries the 12 V dips each time the drive motor starts, so the drive resets and tries again. An ageing drive with slow sectors near its start looks the same, so check the supply before replacing the drive.',
  body: doc(
    caution(
      'mains',
      'The ORX-5 main supply sits under the hard disc bracket with its primary side uncovered. Take readings with the recorder on an isolating transformer, and unplug it before touching anything.',
    ),
    caution(
      'stored_charge',
      'The main reservoir capacitor keeps its charge after unplugging. Measure it and discharge it through a 2k2 5 W resistor before lifting the hard disc bracket.',
    ),
    steps(
      'With the top cover off and the recorder on an isolating transformer, switch on and listen: a drive that spins up, stops and spins up again is being reset.',
      'Measure the 12 V feed at the drive power connector during spin-up (reading below).',
      'If it dips, unplug, discharge the supply as above and lift the hard disc bracket.',
      'Replace C1203 on the drive adaptor board with a 105 °C low-ESR part of the same value.',
      'Switch on and time the start-up: the clock should appear within 40 seconds.',
      'If the 12 V holds steady and the start-up is still slow, the drive itself is failing; a new drive of the same interface is formatted by the recorder at its next start, and the old recordings are lost.',
    ),
    reading({
      testPoint: '12 V at the hard disc power connector, during spin-up',
      expected: '11.4-12.6 V',
      measured: 'dips to 9.8 V as the drive motor starts',
      note: 'Oscilloscope on 2 V/div, 50 ms/div, triggered on the falling edge.',
    }),
  ),
  parts: [cap('C1203', '470uF', '16V 105C low-ESR', 'hard disc 12 V filter on the adaptor board')],
  difficulty: 'skilled',
  timeMinutes: 60,
  editSummary: 'First write-up.',
  author: 'tech-dmitri',
  proofer: 'moderator2',
});

const hardDiscStartR2 = revise(hardDiscStartR1, {
  body: doc(
    ...hardDiscStartR1.body.content,
    p('Before fitting a new drive, copy off any recordings the owner wants kept: the recorder formats the new drive at its next start.'),
  ),
  editSummary: 'Added a reminder to copy recordings off before a drive is replaced.',
  author: 'tech-ansel',
  proofer: 'moderator',
});

export const dvdRamPowerFixes: DemoFix[] = [
  {
    slug: 'orx5-no-power-standby-supply',
    machines: ['orvalle/RX-710/PAL', 'orvalle/RX-710/NTSC', 'orvalle/RX-760H/PAL'],
    chassis: ['orvalle-orx5-platform'],
    revisions: [standbyR1, standbyR2],
  },
  {
    slug: 'orx5-switches-off-when-warm',
    machines: ['orvalle/RX-710/PAL', 'orvalle/RX-760H/PAL'],
    chassis: ['orvalle-orx5-platform'],
    revisions: [warmShutdownR1, warmShutdownR2],
  },
  {
    slug: 'rx760h-slow-start-up-hard-disc',
    machines: ['orvalle/RX-760H/PAL'],
    chassis: [],
    revisions: [hardDiscStartR1, hardDiscStartR2],
  },
];
