// Demo fixes for DVD recorders: the recording pickup.
import type { DemoFix } from '../types';
import { caution, doc, figure, h, p, part, rev, revise, steps, table } from './build';

const lensR1 = rev({
  title: 'Shows NO DISC with blank and recorded discs alike',
  symptoms: ['no disc', 'disc error', "won't read discs", 'reads some discs only'],
  errorCodes: ['NO DISC'],
  cause:
    "The recording pickup's lens collects a film of dust and smoke from the cooling air drawn over it. The focus servo can still find the surface of a pressed disc but not the fainter groove of a blank one, so blanks fail first and then everything.",
  body: doc(
    caution(
      'laser',
      'The TL-2 pickup holds a red laser diode that runs at many times playback power when recording. Clean the lens only with the recorder unplugged, and never look into it with power applied.',
    ),
    steps(
      'Unplug the recorder and remove the top cover; the lens is visible through the loader opening with the tray out.',
      'Blow off loose dust with a rubber bulb blower. Do not use canned air: its propellant can frost and crack the lens.',
      'Wet a lens swab with isopropyl alcohol and wipe the lens once, in a light spiral from the centre outwards, with no pressure.',
      'Let it dry for a minute, then look at it under a light: it should be clear blue-violet with no smear.',
      'Close up and try a pressed disc, then a blank disc.',
    ),
  ),
  difficulty: 'routine',
  timeMinutes: 20,
  editSummary: 'First write-up.',
  author: 'tech-esme',
  proofer: 'moderator',
  illustrations: [
    figure(
      'laser-lens',
      'Drawing of an optical pickup on its sled with the round objective lens in the middle.',
      'The pickup lens seen from above through the loader opening.',
    ),
  ],
});

const lensR2 = revise(lensR1, {
  body: doc(
    ...lensR1.body.content,
    h(3, 'Telling a dirty lens from a tired pickup'),
    p('Test with these discs in this order after cleaning:'),
    table(
      ['Disc', 'Clean lens, healthy pickup', 'Pickup worn'],
      ['Pressed film disc', 'Reads', 'Reads, slowly'],
      ['Recorded DVD-R', 'Reads', 'NO DISC or skips'],
      ['Blank DVD-R', 'Formats and records', 'NO DISC'],
    ),
  ),
  editSummary: 'Added a disc sequence to tell a dirty lens from a worn pickup.',
  author: 'editor',
  proofer: 'moderator2',
});

const finalise = rev({
  title: 'Records but fails to finalise, or finalised discs will not play elsewhere',
  symptoms: ['fails to finalise', 'disc error at end of recording', 'recorded discs unreadable in other players'],
  errorCodes: ['E-47'],
  cause:
    "As the recording laser diode ages its output at full write power falls. The recorder's power calibration then fails near the outer edge of the disc, where finalising writes the lead-out, and E-47 appears. Cleaning helps only when the lens is also dirty.",
  body: doc(
    p('Clean the lens first (see the NO DISC fix for the TL-2); if finalising still fails, replace the pickup.'),
    caution(
      'laser',
      'A new pickup is shipped with a solder blob shorting the laser diode to protect it from static. Remove the blob only after the flex cable is plugged in, and never power the pickup outside the loader.',
    ),
    steps(
      'Unplug the recorder, wear an earthed wrist strap and remove the loader.',
      'Undo the sled guide rod screw and lift the rod with the pickup off the worm gear; note which way the rack spring sits.',
      'Move the rod and rack spring to the new pickup, seat it on the worm gear, and refit the screw.',
      'Plug in the flex, then remove the solder short with a clean iron and wick.',
      'Record ten minutes to a new blank disc, finalise, and play it in another player.',
    ),
  ),
  parts: [part('optical_pickup', 'TL-2 recording pickup', { notes: 'shipped with a solder short on the flex' })],
  difficulty: 'skilled',
  timeMinutes: 90,
  editSummary: 'First write-up.',
  author: 'tech-hugo',
  proofer: 'moderator2',
});

export const dvdRecorderOpticsFixes: DemoFix[] = [
  {
    slug: 'tl2-no-disc-dirty-lens',
    machines: ['tamberlyn/DR-4120/PAL', 'tamberlyn/DR-4120K/PAL'],
    chassis: ['tamberlyn-tl2-loader'],
    revisions: [lensR1, lensR2],
  },
  { slug: 'dr4120k-fails-to-finalise-e47', machines: ['tamberlyn/DR-4120K/PAL'], chassis: ['tamberlyn-tl2-loader'], revisions: [finalise] },
];
