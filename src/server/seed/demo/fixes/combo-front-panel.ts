// Demo fixes for VHS/DVD combination recorders: the front panel and remote control.
import type { DemoFix } from '../types';
import { cap, caution, doc, p, reading, rev, revise, steps } from './build';

const irReceiverR1 = rev({
  title: 'Remote control ignored or short of range: IR receiver supply',
  symptoms: ['remote not working', 'IR range very short', 'front panel keys respond'],
  cause:
    'The QC-3 front panel carries an infrared receiver module fed from the 5 V standby rail through a 100 Ω resistor and decoupled by a small electrolytic. When the capacitor dries, ripple from the standby supply reaches the receiver, and its gain control treats the ripple as interference and turns its own sensitivity down.',
  body: doc(
    caution(
      'mains',
      'The front panel lead runs past the switch-mode supply, whose primary side is uncovered. Unplug before reaching in, and take the powered reading with the recorder on an isolating transformer.',
    ),
    steps(
      'Check the handset first: a phone camera pointed at its front shows the infrared LED flashing when a button is pressed.',
      'Remove the top cover and the front panel, and measure the receiver supply (reading below).',
      'Unplug the recorder and replace C1302 beside the receiver with a 105 °C part of the same value.',
      'Try the handset from across the room and at an angle: it should work from five metres.',
    ),
    reading({
      testPoint: 'IR receiver supply pin, to ground, standby',
      expected: '4.8-5.1 V, ripple under 20 mV',
      measured: '4.6 V with 200 mV ripple',
    }),
  ),
  parts: [cap('C1302', '47uF', '16V 105C', 'IR receiver decoupling')],
  difficulty: 'routine',
  timeMinutes: 25,
  editSummary: 'First write-up.',
  author: 'tech-greta',
  proofer: 'moderator',
});

const irReceiverR2 = revise(irReceiverR1, {
  cause:
    'The QC-3 front panel carries an infrared receiver module fed from the 5 V standby rail through a 100 Ω resistor and decoupled by a small electrolytic. When the capacitor dries, ripple from the standby supply reaches the receiver, and its gain control treats the ripple as interference and turns its own sensitivity down. A window that has gone yellow or been scratched in front of the receiver shortens the range in the same way.',
  body: doc(
    ...irReceiverR1.body.content,
    p(
      'If the supply is clean, polish the window in front of the receiver with plastic polish, or swap it for the window from a scrapped unit.',
    ),
  ),
  editSummary: 'Added the yellowed window as a second cause.',
  author: 'tech-esme',
  proofer: 'moderator2',
});

export const comboFrontPanelFixes: DemoFix[] = [
  {
    slug: 'qc3-remote-ignored-ir-receiver',
    machines: ['quillmere/VDC-900/PAL', 'quillmere/VDC-900/NTSC', 'quillmere/VDC-950T/PAL'],
    chassis: ['quillmere-qc3-combo'],
    revisions: [irReceiverR1, irReceiverR2],
  },
];
