// Demo fixes for video cassette recorders: reel drive, loading and mode-switch faults.
import type { DemoFix } from '../types';
import { caution, doc, figure, h, p, part, rev, revise, steps } from './build';

const idlerR1 = rev({
  title: 'No rewind or fast forward, play still works',
  symptoms: ['no rewind', 'fast forward very slow', 'play works fine', 'rewind stops after a few seconds'],
  cause:
    'On the QM-7 deck one idler swings between the two reel tables for take-up and for the fast winds. Its rubber tyre hardens and glazes with age, so it still grips under the light take-up load but slips under the heavier load of a fast wind. The controller sees the reel sensor pulses stop and cancels the wind.',
  body: doc(
    p(
      'The idler sits under the cassette carriage, between the reel tables. Unplug the unit before you start; nothing in this fix needs power until the final test.',
    ),
    steps(
      'Remove the top cover (four screws at the back) and the front panel (three clips underneath).',
      'Lift out the cassette carriage: two screws on each side and the flat cable to the end sensors.',
      'Find the idler arm between the reel tables. Ease the plastic C-clip off its shaft with a small flat screwdriver and lift the idler wheel off.',
      'Check the tyre: a good one is matt and springs back under a fingernail. A shiny, hard or cracked tyre is the fault.',
      'Stretch a new tyre over the hub so it sits flat with no twist. Clean the reel table rims it drives with isopropyl alcohol on a lint-free swab.',
      'Refit the idler and its clip, then the carriage, and test rewind and fast forward with a full-length tape from both ends.',
    ),
  ),
  parts: [part('idler_tyre', '19 mm OD x 2.5 mm section', { notes: 'QM-7 reel idler' })],
  difficulty: 'careful',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-ansel',
  proofer: 'moderator',
  illustrations: [
    figure(
      'idler-tyre',
      'Drawing of a small idler wheel between two reel tables, its rubber tyre shown shiny and cracked.',
      'The QM-7 reel idler and where its tyre touches the reel tables.',
    ),
  ],
});

const idlerR2 = revise(idlerR1, {
  body: doc(
    ...idlerR1.body.content,
    h(3, 'Check the torque before you close it up'),
    p(
      'With a cassette torque gauge in the carriage, fast wind should pull at least **80 g·cm** at the take-up table. A tyre that passes the fingernail test but reads well under that is still glazed on its running face.',
    ),
  ),
  parts: [...idlerR1.parts, part('mechanical', 'idler shaft C-clip, 2 mm shaft', { notes: 'often cracks when removed; have one ready' })],
  editSummary: 'Added a torque check after refitting and the C-clip as a spare; it often breaks on removal.',
  author: 'editor',
  proofer: 'moderator2',
});

const chewR1 = rev({
  title: 'Chews tape on eject, a loop is left hanging out of the cassette',
  symptoms: ['eats tape on eject', 'tape loop pulled out', 'creased tape after stop'],
  cause:
    'When the TV-5 unloads, the supply reel must wind the slack back into the cassette while the guides return. A hardened pinch roller walks the tape up the capstan during play, and a slipping centre belt leaves the reel too slow to take up the slack, so a loop is still in the path when the carriage lifts.',
  body: doc(
    caution(
      'sharp_edges',
      'The TV-5 top cover and deck frame have unfolded pressed-steel edges; the edge behind the cassette carriage is the worst.',
    ),
    steps(
      'Unplug the unit, remove the top cover and lift out the cassette carriage (two screws, one ribbon).',
      'Check the pinch roller: press a fingernail into it. If it leaves no mark, or the rubber is glossy or cracked, replace the roller.',
      'Remove the centre belt from the capstan pulley to the reel drive pulley. A good belt is square-edged and pulls back when stretched; a perished one is shiny, soft or stays stretched.',
      'Clean both pulleys with isopropyl alcohol and fit a new flat belt.',
      "Test play and eject twenty times with a scrap tape before you trust a customer's tape to it.",
    ),
  ),
  parts: [
    part('pinch_roller', 'TV-5 pinch roller assembly, 13 mm roller'),
    part('belt', 'flat belt 62 mm x 3.5 mm x 0.5 mm', { notes: 'centre belt, capstan to reel pulley' }),
  ],
  difficulty: 'careful',
  timeMinutes: 50,
  editSummary: 'First write-up.',
  author: 'tech-nils',
  proofer: 'moderator',
});

const chewR2 = revise(chewR1, {
  body: doc(
    caution(
      'sharp_edges',
      'The TV-5 top cover and deck frame have unfolded pressed-steel edges; the edge behind the cassette carriage is the worst.',
    ),
    h(3, 'If a tape is trapped in the machine now'),
    p(
      'Do not pull it out. With the unit unplugged, turn the loading motor worm by hand to return the guides, then wind the slack into the cassette with a pencil in the supply hub before lifting the cassette out.',
    ),
    ...chewR1.body.content.slice(1),
  ),
  editSummary: 'Added how to free a trapped tape without cutting it.',
  author: 'tech-celia',
  proofer: 'moderator2',
  illustrations: [
    figure(
      'pinch-roller',
      'Drawing of a pinch roller pressing tape against a capstan shaft, with the hardened rubber surface marked.',
      'Pinch roller against the capstan: the rubber must be matt and slightly soft.',
    ),
  ],
});

const modeSwitch = rev({
  title: 'Takes the tape in, then spits it straight back out',
  symptoms: ['tape ejects immediately', 'loads then ejects', 'will not play, returns to stop', 'mechanism hunts back and forth'],
  cause:
    'The controller reads the mechanism position from a rotary mode switch on the cam gear. Its wiper contacts oxidise and the grease under them dries, so the reading no longer matches the commanded position; the controller gives up and ejects. The fault is often intermittent at first and worse when cold.',
  body: doc(
    p('Unplug the unit, remove the covers and the cassette carriage before turning the deck over.'),
    caution(
      'spring',
      'The QM-7 cam gear carries the tension spring for the pinch roller arm, and it jumps when the gear comes off. Hold it down with a finger while you lift the gear.',
    ),
    steps(
      'The mode switch is the round white part under the main cam gear, held by two plastic latches.',
      'Before removing anything, note the alignment marks: the rotor dot lines up with a triangle on the body in the eject position. Photograph it.',
      'Release the latches and open the switch. Clean the contact track and the wiper fingers with contact cleaner on a swab; do not bend the fingers.',
      'Add a thin film of contact grease, reassemble with the marks lined up, and refit.',
      'Run load, play, rewind and eject ten times each.',
    ),
    p('If the tracks are worn through to the board, fit a new switch: cleaning only buys a few months.'),
  ),
  parts: [part('switch', 'QM-7 rotary mode switch, 4-track', { notes: 'replace if the tracks are worn through' })],
  difficulty: 'careful',
  timeMinutes: 60,
  editSummary: 'First write-up.',
  author: 'tech-greta',
  proofer: 'moderator2',
  illustrations: [
    figure(
      'mode-switch',
      'Drawing of a round rotary switch with curved contact tracks, a wiper and an alignment dot.',
      'Mode switch under the cam gear; line up the dot with the triangle on reassembly.',
    ),
  ],
});

const centreBelt = rev({
  title: 'Plays for a few seconds, then stops and switches off',
  symptoms: ['stops after 5 seconds', 'switches itself off on play', 'take-up reel not turning'],
  cause:
    'The controller watches the take-up reel sensor and stops the deck if the reel stands still, to save the tape; on the TV-5 it then drops to standby. The reel is driven from the capstan by a small centre belt that stretches and slips with age.',
  body: doc(
    p('Watch the take-up reel through the window: if it stops or stutters just before the shut-down, this is the fault.'),
    steps(
      'Unplug the unit, remove the top cover and the cassette carriage.',
      'Turn the deck over and remove the capstan motor screws if the belt cannot be reached; on most TV-5 decks it can be lifted off from below.',
      'Clean the capstan pulley and the reel drive pulley with isopropyl alcohol; old belts leave a black glaze that makes a new belt slip too.',
      'Fit the new belt without twisting it and turn the capstan by hand to seat it.',
      'Play a tape to the end and back; the reel must turn steadily without stopping.',
    ),
  ),
  parts: [part('belt', 'flat belt 62 mm x 3.5 mm x 0.5 mm', { notes: 'centre belt, same as the eject-chewing fix' })],
  difficulty: 'routine',
  timeMinutes: 30,
  editSummary: 'First write-up.',
  author: 'tech-oona',
  proofer: 'moderator',
  illustrations: [
    figure(
      'belt-path',
      'Drawing of a belt running from a small motor pulley to a larger flywheel.',
      'Centre belt path from the capstan to the reel pulley.',
    ),
  ],
});

const carriageR1 = rev({
  title: 'Cassette will not go in, or is stuck in the carriage',
  symptoms: ["tape won't go in", 'cassette stuck inside', 'carriage jams halfway', 'eject does nothing'],
  cause:
    'The front-loading carriage is driven by a gear rack from the loading motor. When a tape is forced in, or something else is posted through the flap, the rack jumps a tooth and the carriage falls out of step with the cam gear; the controller then stalls the motor halfway and stops.',
  body: doc(
    caution(
      'spring',
      'The door flap and the cassette lift arms on the QM-7 carriage are spring loaded; the lift spring can fly out when the side plate comes off.',
    ),
    steps(
      'Unplug the unit. To free a stuck cassette, turn the loading motor worm by hand, with a flat screwdriver in its slot, towards eject until the cassette rises.',
      'Remove the carriage: two screws each side and the sensor cable.',
      'Look for a broken tooth on the side rack or the drive gear. Replace a broken gear; a bent rack can usually be straightened.',
      'Put the cam gear in the eject position (its marked hole over the hole in the deck plate).',
      'Refit the carriage in the fully raised position so the two timing holes on its side gear line up, then mesh the rack.',
      'Test loading with a scrap cassette, then with the lid open to watch the lift arms move in step.',
    ),
  ),
  parts: [part('mechanical', 'QM-7 carriage side gear', { notes: 'only if a tooth is broken' })],
  difficulty: 'careful',
  timeMinutes: 75,
  editSummary: 'First write-up.',
  author: 'tech-hugo',
  proofer: 'moderator',
});

const carriageR2 = revise(carriageR1, {
  cause:
    'The front-loading carriage is driven by a gear rack from the loading motor. When a tape is forced in, or something else is posted through the flap, the rack jumps a tooth and the carriage falls out of step with the cam gear; the controller then stalls the motor halfway and stops. Check for a coin or a toy behind the flap before anything else.',
  editSummary: 'Noted to look for foreign objects first; added the timing drawing.',
  author: 'moderator2',
  proofer: 'moderator',
  illustrations: [
    figure(
      'tray-gear',
      'Drawing of a gear train with two timing marks, a dot and a triangle, lined up across the mesh.',
      'Carriage side gear and rack with their timing marks lined up.',
    ),
  ],
});

export const vcrMechanismFixes: DemoFix[] = [
  {
    slug: 'qm7-no-rewind-glazed-idler',
    machines: ['quillmere/VR-3100/PAL', 'quillmere/VR-3100/NTSC'],
    chassis: ['quillmere-qm7-deck'],
    revisions: [idlerR1, idlerR2],
  },
  {
    slug: 'tv5-chews-tape-on-eject',
    machines: ['tamberlyn/TV-820/PAL', 'tamberlyn/TV-825K/PAL'],
    chassis: ['tamberlyn-tv5-deck'],
    revisions: [chewR1, chewR2],
  },
  {
    slug: 'qm7-loads-then-ejects-mode-switch',
    machines: ['quillmere/VR-3150S/PAL'],
    chassis: ['quillmere-qm7-deck'],
    revisions: [modeSwitch],
  },
  {
    slug: 'tv5-stops-after-seconds-centre-belt',
    machines: ['tamberlyn/TV-825K/PAL', 'tamberlyn/TV-825K/NTSC'],
    chassis: ['tamberlyn-tv5-deck'],
    revisions: [centreBelt],
  },
  {
    slug: 'qm7-cassette-stuck-in-carriage',
    machines: ['quillmere/VR-3100/PAL'],
    chassis: ['quillmere-qm7-deck'],
    revisions: [carriageR1, carriageR2],
  },
];
