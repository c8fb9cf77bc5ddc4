// Demo fixes for tape camcorders: cassette compartment, dew lockout, heads, viewfinder, zoom and power.
import type { DemoFix } from '../types';
import { cap, caution, doc, figure, h, p, part, reading, rev, revise, steps } from './build';

const doorR1 = rev({
  title: 'Cassette door will not close, or springs back open',
  symptoms: ["cassette door won't close", 'door springs back open', 'compartment will not go down'],
  cause:
    'The HM-2 cassette compartment is lifted by a pair of torsion springs and latched down by a small hook on the mechanism. When the mechanism has stopped part-way through an eject, for example on a flat battery, the hook is left in the wrong place and the compartment cannot lock down.',
  body: doc(
    caution(
      'spring',
      'The compartment lift springs on the HM-2 are strong for their size; a released spring can fly into an eye. Keep the compartment held down with a thumb while its screws are out.',
    ),
    caution('sharp_edges', 'The compartment side plates are thin stamped steel with sharp edges.'),
    steps(
      'Remove the battery and any power lead. Never force the door: the plastic hinge breaks.',
      'Fit a charged battery and press eject once: a mechanism stopped mid-cycle often finishes its eject and frees the door.',
      'If it does not, remove the side cover (five screws) and turn the loading motor worm by hand towards eject until the compartment lifts fully.',
      'Check that the latch hook on the right of the compartment moves freely; clean old grease off it if it sticks.',
      'Close the compartment with a cassette fitted and listen for the latch click.',
    ),
  ),
  difficulty: 'careful',
  timeMinutes: 40,
  editSummary: 'First write-up.',
  author: 'tech-mina',
  proofer: 'moderator',
});

const doorR2 = revise(doorR1, {
  body: doc(
    ...doorR1.body.content,
    h(3, 'If the latch is broken'),
    p('A hook snapped off by forcing the door must be replaced with the compartment assembly; glued hooks let go within days.'),
  ),
  parts: [part('mechanical', 'HM-2 cassette compartment assembly', { notes: 'only if the latch hook is broken' })],
  editSummary: 'Added the broken-latch case and the compartment as a part.',
  author: 'tech-oona',
  proofer: 'moderator2',
});

const dew = rev({
  title: 'Shows DEW and H-04, will not operate in a dry room',
  symptoms: ['DEW warning', 'H-04 on display', 'condensation lockout', 'will not play or eject'],
  errorCodes: ['H-04'],
  cause:
    'A resistive dew sensor on the drum base locks the mechanism out when moisture could make the tape stick to the drum. Its resistance rises with humidity; corrosion on its pads or a sensor aged by damp storage reads wet all the time.',
  body: doc(
    p(
      'First rule out real condensation: leave the camcorder with its compartment open in a warm, dry room for two hours. If DEW clears, there is nothing to repair.',
    ),
    steps(
      'Remove the battery. Open the side cover and find the dew sensor: a small rectangle on a strip of flexible board beside the drum.',
      'Measure it (reading below) with the camcorder off.',
      'Clean green or white corrosion off its pads and the flex connector with isopropyl alcohol and a fibre pen.',
      'If the sensor still reads high, replace it; do not bridge it, as that removes the protection for the customer.',
    ),
    reading({
      testPoint: 'Dew sensor, dry room, camcorder off',
      expected: 'a few kΩ',
      measured: 'over 100 kΩ',
      note: 'Breathe on it: a good sensor rises sharply and falls back within a minute.',
    }),
  ),
  parts: [part('other', 'HM-2 dew sensor on flex', { notes: 'only if it still reads high after cleaning' })],
  difficulty: 'careful',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-celia',
  proofer: 'moderator2',
});

const blocky = rev({
  title: 'Blocky picture and F-21 tape error on playback',
  symptoms: ['blocky picture', 'mosaic on playback', 'F-21 tape error', 'no picture on playback'],
  errorCodes: ['F-21'],
  cause:
    'The KC-22D reads tracks only a few microns wide, and a speck of shed binder in a head gap is enough to lose them. The picture breaks into blocks and then the camcorder stops with F-21. Cheap or mixed tape brands clog the heads fastest.',
  body: doc(
    steps(
      'Play a MiniDV cleaning cassette for no more than ten seconds, once; more wears the heads.',
      'Play a known-good recording. If it is clean, stop here.',
      'If the fault stays, remove the battery and open the tape compartment cover plates.',
      'Clean the drum with a chamois stick and isopropyl alcohol, turning the drum by hand; never move the stick up and down.',
      'Play the known-good tape again; if blocks remain on one half of the picture, a head is worn.',
    ),
  ),
  parts: [part('other', 'MiniDV cleaning cassette')],
  difficulty: 'routine',
  timeMinutes: 15,
  editSummary: 'First write-up.',
  author: 'tech-ilse',
  proofer: 'moderator',
});

const viewfinder = rev({
  title: 'Viewfinder blank, recordings fine',
  symptoms: ['viewfinder blank', 'no picture in eyepiece', 'recording works'],
  cause:
    "The HC-8A's monochrome tube viewfinder has its own small deflection and high-voltage board. Its tiny electrolytics leak with age, the sweep stops, and the tube is protected by blanking, so the eyepiece stays dark.",
  body: doc(
    caution(
      'stored_charge',
      "The viewfinder tube keeps a few kilovolts on its anode for a while after the battery comes off. Discharge the anode cap to the tube's earth band through a 1 M resistor on an insulated lead before touching the board.",
    ),
    steps(
      'Remove the battery and unscrew the viewfinder from its arm (two screws).',
      'Open the viewfinder housing and discharge the tube as described above.',
      'Replace the four electrolytics on the deflection board; clean off any leaked electrolyte with isopropyl alcohol.',
      'Reassemble and check the picture and focus ring.',
    ),
  ),
  parts: [
    cap('C701', '10uF', '16V 85C', 'vertical sweep', 2),
    cap('C705', '47uF', '10V 85C', 'horizontal supply'),
    cap('C709', '4.7uF', '50V 85C', 'focus supply'),
  ],
  difficulty: 'skilled',
  timeMinutes: 60,
  editSummary: 'First write-up.',
  author: 'tech-farid',
  proofer: 'moderator2',
});

const smdR1 = rev({
  title: 'No power on battery or power adaptor, or dead after a few minutes',
  symptoms: ['no power', 'turns on then off', 'dead on battery and adaptor', 'fishy smell from the case'],
  cause:
    'The HC-85H power board uses small surface-mount electrolytic capacitors that leak after fifteen years or so. The electrolyte eats the copper tracks beside them, and the DC-to-DC converter loses its feedback or its input filter.',
  body: doc(
    caution(
      'heat',
      'Removing surface-mount electrolytics takes a hot-air station or two irons at once; the board is small and nearby plastic parts melt. Shield them with heat-resistant tape.',
    ),
    steps(
      'Remove the battery and adaptor, then open the left side panel to reach the power board.',
      'Look for a grey or brown film around the capacitors and a fishy smell: both mark leaking electrolyte.',
      'Remove every electrolytic on the board, clean the pads and tracks with isopropyl alcohol and a fibre pen, and check each track for breaks with a meter.',
      'Repair broken tracks with fine wire, then fit new capacitors (solid polymer types of the same value and voltage are fine here).',
      'Power up on the adaptor and check the converter outputs.',
    ),
    reading({ testPoint: '5 V converter output at C912', expected: '4.9-5.1 V', measured: '0 V, or pulsing' }),
  ),
  parts: [
    cap('C901', '22uF', '16V 105C SMD', 'converter input', 2),
    cap('C912', '47uF', '6.3V 105C SMD', '5 V output'),
    cap('C915', '10uF', '25V 105C SMD', 'motor supply'),
  ],
  difficulty: 'skilled',
  timeMinutes: 120,
  editSummary: 'First write-up.',
  author: 'tech-lucan',
  proofer: 'moderator',
});

const smdR2 = revise(smdR1, {
  cause:
    'The HC-85H power board uses small surface-mount electrolytic capacitors that leak after fifteen years or so. The electrolyte eats the copper tracks beside them, and the DC-to-DC converter loses its feedback or its input filter. The same capacitors sit on the drum servo board, which shows as a drum that will not spin.',
  parts: [...smdR1.parts, cap('C521', '10uF', '16V 105C SMD', 'drum servo board', 2)],
  editSummary: 'Added the drum servo board capacitors, which leak at the same age.',
  author: 'moderator2',
  proofer: 'moderator',
  illustrations: [
    figure(
      'bulging-capacitor',
      'Drawing of a capacitor with a domed top and a stain at its base.',
      'A leaking electrolytic leaves a stain and corrodes the tracks.',
    ),
  ],
});

const zoomRocker = rev({
  title: 'Zoom rocker dead or half-working: carbon tracks under the boot',
  symptoms: ['zoom not working', 'telephoto dead, wide angle works', 'zoom motor silent'],
  cause:
    'The HC-8A zoom rocker is a pair of carbon-track contacts under a rubber boot on the handle. Skin oil and dust work in under the boot, the tracks go high-resistance, and the zoom driver reads one or both directions as released. The zoom motor itself rarely fails, and can be checked by feeding it directly.',
  body: doc(
    steps(
      'Remove the battery and the cassette, then the four screws of the handle cover.',
      'Lift the rocker board and measure each direction with the rocker pressed (reading below).',
      'Clean the carbon tracks and the contact pads with isopropyl alcohol on a lint-free swab and let them dry.',
      'If a track is worn through, fit a new rocker board rather than clean it again.',
      'Check the zoom motor by feeding 3 V from a bench supply across its leads: it should run smoothly both ways when reversed.',
      'Refit the boot so it seals all round, and try the zoom through its whole range in both directions.',
    ),
    reading({
      testPoint: 'Rocker board, common to each direction, rocker pressed',
      expected: 'under 200 Ω',
      measured: 'tele side 15-40 kΩ, wide side 150 Ω',
    }),
  ),
  parts: [part('switch', 'zoom rocker board with rubber boot', { notes: 'only if a carbon track is worn through' })],
  difficulty: 'careful',
  timeMinutes: 35,
  editSummary: 'First write-up.',
  author: 'tech-esme',
  proofer: 'moderator2',
});

export const camcorderFixes: DemoFix[] = [
  {
    slug: 'hm2-cassette-door-will-not-close',
    machines: ['halvorin/HC-8A/PAL', 'halvorin/HC-8A/NTSC', 'halvorin/HC-85H/PAL'],
    chassis: ['halvorin-hm2-mechanism'],
    revisions: [doorR1, doorR2],
  },
  {
    slug: 'hm2-dew-lockout-h04',
    machines: ['halvorin/HC-85H/PAL', 'halvorin/HC-8A/PAL'],
    chassis: ['halvorin-hm2-mechanism'],
    revisions: [dew],
  },
  { slug: 'kc22d-blocky-playback-f21', machines: ['kestrune/KC-22D/PAL', 'kestrune/KC-22D/NTSC'], chassis: [], revisions: [blocky] },
  { slug: 'hc8a-viewfinder-blank', machines: ['halvorin/HC-8A/PAL', 'halvorin/HC-8A/NTSC'], chassis: [], revisions: [viewfinder] },
  {
    slug: 'hc85h-no-power-leaking-capacitors',
    machines: ['halvorin/HC-85H/PAL'],
    chassis: ['halvorin-hm2-mechanism'],
    revisions: [smdR1, smdR2],
  },
  {
    slug: 'hc8a-zoom-dead-rocker-contacts',
    machines: ['halvorin/HC-8A/PAL', 'halvorin/HC-8A/NTSC'],
    chassis: [],
    revisions: [zoomRocker],
  },
];
