// Demo fixes for MiniDisc machines: the recording head and its lift.
import type { DemoFix } from '../types';
import { caution, doc, figure, p, part, reading, rev, steps } from './build';

const overwriteHead = rev({
  title: 'Recording fails with F-44: the overwrite head does not come down',
  symptoms: ['recording fails', 'F-44 on display', 'playback normal', 'overwrite head stays raised'],
  errorCodes: ['F-44'],
  cause:
    "A MiniDisc recorder writes with the laser heating the disc from below and a magnetic overwrite head pressing on the cartridge from above. On the MD-30 the head is lowered by a lever from the loading sled, and as its light spring weakens and the lever pivot gums up, the head hovers above the disc. Without the head's field the written sectors fail their check and the controller stops with F-44.",
  body: doc(
    caution(
      'laser',
      'The pickup runs at write power during a recording test with the cover off. Never look into the lens or at the disc surface from below while the deck is powered.',
    ),
    caution('spring', 'The head lift lever spring is tiny and jumps when unhooked. Wear eye protection and work over a tray.'),
    steps(
      'Unplug the deck, remove the top cover and the loader top plate.',
      'Load a disc by hand and watch the overwrite head: it should rest on the cartridge top with its slider touching.',
      'If it hovers, clean the lever pivot with isopropyl alcohol and add the smallest touch of light grease.',
      'Replace the lever spring if the head still does not settle under its own spring when the lever is released.',
      'Measure the head coil (reading below); an open coil needs a new head.',
      'Record a five-minute track, then play it back to the end: no F-44.',
    ),
    reading({
      testPoint: 'Overwrite head coil, at its flexible lead',
      expected: '4-8 Ω',
      measured: 'open (no reading) on a failed head',
      note: 'Deck unplugged, lead unplugged from the main board.',
    }),
    p('A head whose slider is chipped or scratched will also scratch the cartridge tops; replace it rather than refit it.'),
  ),
  parts: [part('mechanical', 'head lift lever spring', { notes: 'MD-30 loading sled' })],
  difficulty: 'skilled',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-katya',
  proofer: 'moderator',
  illustrations: [
    figure(
      'laser-lens',
      'Drawing of an optical pickup seen from above, with its round lens in the middle.',
      'The overwrite head sits directly above this lens on the other side of the cartridge.',
    ),
  ],
});

export const miniDiscFixes: DemoFix[] = [
  { slug: 'md30-will-not-record-f44-overwrite-head', machines: ['kestrune/MD-30/multi'], chassis: [], revisions: [overwriteHead] },
];
