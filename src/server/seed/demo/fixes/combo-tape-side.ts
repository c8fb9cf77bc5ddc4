// Demo fixes for VHS/DVD combination recorders: faults on the tape side, mechanical and colour.
import type { DemoFix } from '../types';
import { caution, doc, p, part, reading, rev, revise, steps } from './build';

const clutchR1 = rev({
  title: 'VHS side eats tapes, DVD side fine',
  symptoms: ['eats tape', 'chews tapes on play', 'tape crinkled after playing', 'loop of tape in the machine'],
  cause:
    'The slimmed deck in the QC-3 drives its take-up reel through a felt slip clutch. The felt glazes and the clutch spring weakens, so the take-up torque falls, the reel stops pulling, and the capstan feeds tape into the machine instead of the cassette.',
  body: doc(
    caution(
      'spring',
      'The take-up clutch on the QC-3 holds a compressed coil spring under its retaining washer; it flies off when the washer is released.',
    ),
    caution(
      'sharp_edges',
      "The DVD loader's steel shield sits right above the tape deck with a raw edge facing it; cover it with tape while you work.",
    ),
    steps(
      'Unplug the unit, remove the cover and unplug the DVD loader cables; lift the loader off its bracket.',
      'Remove the tape carriage, then ease the washer off the take-up reel table while pressing it down with a finger.',
      'Lift out the spring and the clutch felt. Replace the felt; stretch the spring by 1 mm if it is shorter than the new one.',
      'Reassemble and check the torque (reading below), then play a scrap tape to the end.',
    ),
    reading({ testPoint: 'Take-up reel table in play, cassette torque gauge', expected: '60-100 g·cm', measured: 'under 30 g·cm' }),
  ),
  parts: [
    part('mechanical', 'QC-3 take-up clutch felt, 11 mm OD'),
    part('pinch_roller', 'QC-3 pinch roller', { notes: 'replace at the same time if hard' }),
  ],
  difficulty: 'skilled',
  timeMinutes: 80,
  editSummary: 'First write-up.',
  author: 'tech-hugo',
  proofer: 'moderator',
});

const clutchR2 = revise(clutchR1, {
  body: doc(
    ...clutchR1.body.content.slice(0, 2),
    p(
      'Before opening, take the tape out of a chewed cassette and check whether the loop is on the take-up side. If it is on the supply side the fault is back-tension, not this clutch.',
    ),
    ...clutchR1.body.content.slice(2),
  ),
  editSummary: 'Added a check of which side the loop is on before dismantling.',
  author: 'moderator2',
  proofer: 'moderator',
});

const erSeven = rev({
  title: 'Er-07 at switch-on, VHS side dead, DVD side works',
  symptoms: ['Er-07 on display', 'VHS will not load', 'tape side does nothing'],
  errorCodes: ['Er-07'],
  cause:
    'Er-07 is the QC-3 code for a tape mechanism whose position the controller cannot find at switch-on. The slim deck uses the same style of rotary mode switch as the QM-7, and its contacts tarnish in the same way.',
  body: doc(
    p('Unplug the unit. The DVD loader must come off first to reach the tape deck.'),
    caution('spring', 'The pinch roller arm spring is hooked onto the cam gear: hold it while you lift the gear.'),
    steps(
      'Lift off the DVD loader and the tape carriage.',
      'Turn the deck over and photograph the mode switch alignment marks.',
      'Open the switch, clean the tracks and wipers with contact cleaner and add a thin film of contact grease.',
      'Reassemble with the marks lined up and switch on: the deck should cycle once and stop without Er-07.',
    ),
  ),
  parts: [part('switch', 'QC-3 rotary mode switch', { notes: 'replace if the tracks are worn through' })],
  difficulty: 'careful',
  timeMinutes: 70,
  editSummary: 'First write-up.',
  author: 'tech-greta',
  proofer: 'moderator2',
});

const slowRewind = rev({
  title: 'Rewinds slowly and stops before the start of the tape',
  symptoms: ['slow rewind', 'rewind stops early', 'fast forward weak'],
  cause:
    'The QC-3 deck drives its reels from the capstan through a belt and an idler. The belt loses its grip as it ages, so the idler is driven too slowly for the heavier load of a full reel and stalls before the tape end.',
  body: doc(
    p('Unplug the unit and remove the DVD loader to reach the deck.'),
    steps(
      'Turn the deck over and lift the reel belt off the capstan pulley and the idler pulley.',
      'Clean both pulleys and the idler tyre with isopropyl alcohol.',
      'Fit the new belt; replace the idler tyre too if it is shiny.',
      'Rewind a full-length tape from the end; it should reach the start in under three minutes.',
    ),
  ),
  parts: [
    part('belt', 'flat belt 55 mm x 3 mm x 0.4 mm', { notes: 'QC-3 reel drive belt' }),
    part('idler_tyre', '16 mm OD x 2 mm section', { notes: 'only if glazed' }),
  ],
  difficulty: 'careful',
  timeMinutes: 50,
  editSummary: 'First write-up.',
  author: 'tech-katya',
  proofer: 'moderator',
});

const chromaCrystal = rev({
  title: 'VHS playback in monochrome: colour killer cuts in, chroma reference drifted',
  symptoms: ['no colour on VHS playback', 'monochrome playback', 'colour flickers in and out'],
  cause:
    'On PAL playback the CX-330 rebuilds the colour from the tape against a 4.43 MHz reference from a crystal oscillator on the video board. The trimmer capacitor beside the crystal drifts and its contacts corrode, the reference falls outside the lock range of the colour circuit, and the colour killer switches colour off rather than show wrong colours. The DVD side has its own encoder and is not affected.',
  body: doc(
    caution(
      'mains',
      'The CX-330 video board sits above the power supply, whose primary side is uncovered. Make the powered adjustment with the recorder on an isolating transformer and a plastic trimming tool.',
    ),
    steps(
      'Play a colour tape recorded on this machine and one recorded elsewhere: if both play in monochrome, the fault is in playback, not the tape.',
      'Remove the top cover and measure the reference at TP401 with a frequency counter (reading below).',
      'Turn trimmer CT401 slowly with a plastic tool until the counter reads the expected frequency and colour appears.',
      'If the trimmer is crackly or will not reach the frequency, unplug the recorder and replace it.',
      'Play tapes from several machines and check that colour holds steady from the start of each.',
    ),
    reading({
      testPoint: 'TP401, chroma reference oscillator, in play',
      expected: '4.433619 MHz ± 50 Hz',
      measured: '4.43425 MHz',
      note: 'The PAL colour subcarrier is 4.43361875 MHz.',
    }),
  ),
  parts: [part('capacitor', '5-30pF trimmer', { ref: 'CT401', notes: 'only if crackly or out of range' })],
  difficulty: 'skilled',
  timeMinutes: 40,
  editSummary: 'First write-up.',
  author: 'tech-jonah',
  proofer: 'moderator2',
});

export const comboTapeSideFixes: DemoFix[] = [
  {
    slug: 'qc3-vhs-side-eats-tape',
    machines: ['quillmere/VDC-900/PAL', 'quillmere/VDC-900/NTSC', 'quillmere/VDC-950T/PAL'],
    chassis: ['quillmere-qc3-combo'],
    revisions: [clutchR1, clutchR2],
  },
  {
    slug: 'qc3-er-07-mode-switch',
    machines: ['quillmere/VDC-900/PAL', 'quillmere/VDC-950T/PAL'],
    chassis: ['quillmere-qc3-combo'],
    revisions: [erSeven],
  },
  {
    slug: 'qc3-slow-rewind-reel-belt',
    machines: ['quillmere/VDC-900/PAL', 'quillmere/VDC-900/NTSC'],
    chassis: ['quillmere-qc3-combo'],
    revisions: [slowRewind],
  },
  { slug: 'cx330-tape-plays-black-and-white', machines: ['orvalle/CX-330/PAL'], chassis: [], revisions: [chromaCrystal] },
];
