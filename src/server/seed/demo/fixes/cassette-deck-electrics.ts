// Demo fixes for cassette decks: heads, auto-reverse control and the power supply.
import type { DemoFix } from '../types';
import { cap, caution, doc, figure, p, part, reading, rev, revise, steps } from './build';

const demag = rev({
  title: 'Treble dull and hiss up after years of use',
  symptoms: ['dull sound', 'no treble', 'more hiss than before', 'recordings sound muffled'],
  cause:
    'Heads and steel guides pick up residual magnetism over years of use, from a magnetised screwdriver or from the deck being switched off mid-play. A magnetised head partly erases the high frequencies of every tape played and adds hiss.',
  body: doc(
    p('Clean the heads first: dirt gives the same symptom. Unplug the deck and take out any cassette.'),
    steps(
      'Remove the cassette door so the heads are exposed.',
      "Switch the handheld head demagnetiser on at arm's length from the deck, never near the heads.",
      "Bring its tip slowly to the record/play head, move it gently up and down across the head face without touching, then draw it slowly away to arm's length before switching it off.",
      'Repeat for the erase head, the capstan and each steel tape guide.',
      'Play a known-good recording and listen for the treble.',
    ),
    reading({
      testPoint: 'Head face, pocket magnetometer',
      expected: "no reading above the meter's zero",
      measured: 'a small deflection',
      note: 'Check after demagnetising, not only before.',
    }),
  ),
  parts: [part('other', 'handheld head demagnetiser', { notes: 'tool, not fitted' })],
  difficulty: 'routine',
  timeMinutes: 15,
  editSummary: 'First write-up.',
  author: 'tech-oona',
  proofer: 'moderator',
});

const reverseR1 = rev({
  title: 'Auto-reverse flips direction by itself in mid-tape',
  symptoms: ['reverses by itself', 'changes direction mid-tape', 'auto-reverse hunts', 'stops and flips repeatedly'],
  cause:
    'The TD-570R knows the tape has reached its end when the take-up spool stops sending pulses from its reel sensor. A slipping take-up clutch or a dirty sensor makes the pulses falter in mid-tape, and the deck takes that for the end and reverses.',
  body: doc(
    p('Unplug the deck and remove the top cover and the transport.'),
    caution(
      'spring',
      'The rotating head on the TD-570R is turned by a spring-loaded cam; keep fingers clear of it when you move the mechanism by hand.',
    ),
    steps(
      'Find the reel sensor under the take-up hub: a small slotted disc turning in an optical gate.',
      'Blow dust out of the gate and wipe the slotted disc clean.',
      'Check the take-up clutch torque; a slipping clutch gives irregular pulses even with a clean sensor.',
      'Replace the clutch felt if the torque is low, refit and play a C90 through both sides.',
    ),
  ),
  parts: [part('mechanical', 'TD-570R take-up clutch felt, 9 mm OD', { notes: 'only if the torque is low' })],
  difficulty: 'careful',
  timeMinutes: 55,
  editSummary: 'First write-up.',
  author: 'tech-nils',
  proofer: 'moderator2',
});

const reverseR2 = revise(reverseR1, {
  body: doc(
    ...reverseR1.body.content,
    reading({ testPoint: 'Take-up hub in play, cassette torque gauge', expected: '40-60 g·cm', measured: 'under 25 g·cm, or swinging' }),
  ),
  editSummary: 'Added the take-up torque reading.',
  author: 'tech-hugo',
  proofer: 'moderator',
});

const humR1 = rev({
  title: 'Hum in both channels, louder with the volume down',
  symptoms: ['hum', 'mains hum in both channels', 'buzz in the background'],
  cause:
    'The TD-550 has a linear supply: a transformer, a bridge rectifier and one large reservoir capacitor. After thirty years that capacitor has lost much of its capacitance and the ripple rides through the regulators into the audio.',
  body: doc(
    caution(
      'mains',
      'The TD-550 power switch and transformer primary are wired at mains voltage beside the reservoir capacitor; the switch terminals are uncovered.',
    ),
    caution(
      'stored_charge',
      'The reservoir capacitor C101 holds its charge after switch-off. It is low voltage, but the current from a shorted tool can weld it; discharge it through a 100 ohm 2 W resistor.',
    ),
    steps(
      'Unplug the deck and remove the top cover.',
      'Discharge C101 as above and check with a meter that it reads under 1 V.',
      'Replace C101 with a 105 °C part of the same capacitance and at least the same voltage; check that the can diameter fits the clamp.',
      'Replace the two smaller smoothing capacitors after the regulators too.',
      'Power up and listen with the volume at zero and at maximum.',
    ),
    reading({ testPoint: 'Ripple across C101', expected: 'under 0.5 V peak to peak', measured: '2-3 V peak to peak' }),
  ),
  parts: [
    cap('C101', '2200uF', '35V 105C', 'main reservoir, snap-in can 25 mm'),
    cap('C105', '220uF', '25V 105C', 'after the 15 V regulator'),
    cap('C106', '220uF', '25V 105C', 'after the -15 V regulator'),
  ],
  difficulty: 'skilled',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-ansel',
  proofer: 'moderator',
});

const humR2 = revise(humR1, {
  body: doc(
    ...humR1.body.content,
    p('If the hum stays after the capacitors, look at the signal earth: the screw tag by the input sockets corrodes and loosens.'),
  ),
  editSummary: 'Added the earth tag check for hum that survives new capacitors.',
  author: 'moderator',
  proofer: 'moderator2',
  illustrations: [
    figure(
      'bleed-resistor',
      "Drawing of a resistor in insulated clips across a capacitor's leads, with a meter.",
      'Discharging the reservoir capacitor and confirming it with a meter.',
    ),
  ],
});

export const cassetteDeckElectricsFixes: DemoFix[] = [
  {
    slug: 'deck-dull-treble-magnetised-heads',
    machines: ['brindlecote/TD-550/multi', 'brindlecote/TD-590/multi', 'kestrune/KT-44/multi'],
    chassis: [],
    revisions: [demag],
  },
  {
    slug: 'td570r-auto-reverse-flips-mid-tape',
    machines: ['brindlecote/TD-570R/multi'],
    chassis: ['brindlecote-bt4-transport'],
    revisions: [reverseR1, reverseR2],
  },
  { slug: 'td550-hum-reservoir-capacitor', machines: ['brindlecote/TD-550/multi'], chassis: [], revisions: [humR1, humR2] },
];
