// Demo fixes for DVD recorders: the video outputs.
import type { DemoFix } from '../types';
import { cap, caution, doc, figure, reading, rev, steps } from './build';

const greenCap = rev({
  title: 'Magenta cast on the RGB output: green coupling capacitor dried out',
  symptoms: ['magenta cast on RGB', 'green missing from the picture', 'composite output looks normal'],
  cause:
    'The TL-2 recorders drive the RGB lines of the SCART socket through a 75 Ω amplifier with an electrolytic coupling capacitor on each output. The green one stands beside the warm video regulator and loses capacitance, so the green signal loses level and its low frequencies. With green weak the picture takes a magenta cast; the composite output does not pass through that capacitor and looks normal.',
  body: doc(
    caution(
      'mains',
      'The AV board sits next to the switch-mode supply on the TL-2. Unplug before soldering, and take the powered reading with the recorder on an isolating transformer.',
    ),
    steps(
      'Confirm the fault: set the recorder to composite output and check that the colours are right, then back to RGB.',
      'Measure the green output level with a 75 Ω load on the SCART socket (reading below).',
      'Unplug the recorder, remove the top cover and find C705 beside the video regulator on the AV board.',
      'Replace C705, and C703 and C707 on red and blue while you are there, with 105 °C parts of the same value.',
      'Check the picture on a colour bar test disc: white should be white and the bars in their proper order.',
    ),
    reading({
      testPoint: 'Green out, SCART pin 11, 75 Ω load, colour bars',
      expected: '0.7 V peak to peak',
      measured: '0.35 V peak to peak, sagging along each line',
    }),
  ),
  parts: [
    cap('C705', '220uF', '10V 105C', 'green output coupling'),
    cap('C703', '220uF', '10V 105C', 'red output coupling, replace with C705'),
    cap('C707', '220uF', '10V 105C', 'blue output coupling, replace with C705'),
  ],
  difficulty: 'careful',
  timeMinutes: 40,
  editSummary: 'First write-up.',
  author: 'tech-celia',
  proofer: 'moderator',
  illustrations: [
    figure(
      'bulging-capacitor',
      'Drawing of an electrolytic capacitor standing beside a finned heatsink.',
      'C705 stands closest to the video regulator heatsink and fails first.',
    ),
  ],
});

export const dvdRecorderOutputFixes: DemoFix[] = [
  {
    slug: 'tl2-colour-cast-green-output-capacitor',
    machines: ['tamberlyn/DR-4120/PAL', 'tamberlyn/DR-4120K/PAL'],
    chassis: ['tamberlyn-tl2-loader'],
    revisions: [greenCap],
  },
];
