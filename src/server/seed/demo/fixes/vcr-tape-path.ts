// Demo fixes for video cassette recorders: heads, audio head, tape threading and back tension.
import type { DemoFix } from '../types';
import { caution, doc, h, p, part, reading, rev, revise, steps, table } from './build';

const headsR1 = rev({
  title: 'Snowy picture on playback of every tape',
  symptoms: ['snowy picture', 'no picture on playback, sound ok', 'noise bars all over', 'own recordings snowy too'],
  cause:
    'A clogged video head stops reading the tape: oxide shed by an old or mouldy tape builds up in the head gap. When one head of a pair clogs, every other field is noise; when both clog there is only snow. Worn heads look the same, so clean first and judge afterwards.',
  body: doc(
    p(
      'Check the tuner picture first, with no tape playing. If that picture is clean, the fault is in the playback path and dirty heads are the usual reason.',
    ),
    steps(
      'Unplug the unit and remove the top cover.',
      'Moisten a chamois cleaning stick (not a cotton bud: its fibres snag the head tips) with isopropyl alcohol of 99 % or better.',
      'Hold the stick flat against the drum and turn the upper drum slowly by hand from its top. **Never** rub up and down across the heads: that snaps the ferrite tips.',
      'Clean the tape guides, the audio/control head and the full-erase head the same way, then the capstan and pinch roller.',
      'Let it dry for five minutes and play a known-good tape.',
      'If one field is still noisy after two cleanings, the head is worn or chipped; the upper drum must be replaced.',
    ),
    table(
      ['What you see after cleaning', 'Likely state'],
      ['Clean picture', 'Heads were clogged'],
      ['Noise on alternate fields', 'One head worn or chipped'],
      ['Snow only, drum turning', 'Both heads worn, or a head amplifier fault'],
    ),
  ),
  parts: [part('other', 'chamois head-cleaning sticks', { quantity: 2 })],
  difficulty: 'routine',
  timeMinutes: 20,
  editSummary: 'First write-up.',
  author: 'tech-dmitri',
  proofer: 'moderator',
});

const headsR2 = revise(headsR1, {
  body: doc(
    ...headsR1.body.content,
    h(3, 'Before the customer tape goes back in'),
    p(
      'Look at the edge of the tape pack through the cassette window. White or grey fuzz is mould, and it will clog freshly cleaned heads within seconds. Such a tape needs cleaning on a tape cleaner first, or it should not be played at all.',
    ),
  ),
  editSummary: 'Added the check for mouldy tapes, which re-clog the heads at once.',
  author: 'moderator2',
  proofer: 'moderator',
});

const threadingR1 = rev({
  title: 'Threading ring stalls, tape only half wrapped round the drum',
  symptoms: ['tape half loaded', 'loading motor whines', 'will not thread', 'shuts off while loading'],
  cause:
    'The Betamax threading ring carries the tape round the drum and is turned by a thin round belt from the loading motor. The belt perishes into a sticky mess or stretches, so the ring stalls part-way and the motor strains until the controller shuts it down.',
  body: doc(
    caution(
      'spring',
      'The threading ring brake on the HB-200 is held on by a hooked tension spring. Unhook it with a spring hook, not fingers, and keep it in view: it is easily lost.',
    ),
    caution('sharp_edges', 'The top-loading cassette basket has sharp pressed edges under its lid.'),
    steps(
      'Unplug the unit and remove the top and bottom covers.',
      'If a tape is inside, turn the loading motor pulley by hand towards unthread until the ring is home, then eject.',
      'Remove the old belt. If it has melted into tar, scrape off the worst with a plastic tool and clean the pulley grooves with isopropyl alcohol until no black comes off on a swab.',
      'Fit the new round belt, turn the pulley by hand through a full thread and unthread, and refit the brake spring.',
      'Test with a scrap tape; threading should take about two seconds and finish without the motor labouring.',
    ),
  ),
  parts: [part('belt', 'round belt 1.5 mm section x 95 mm inside circumference', { notes: 'threading ring belt' })],
  difficulty: 'skilled',
  timeMinutes: 90,
  editSummary: 'First write-up.',
  author: 'tech-lucan',
  proofer: 'moderator2',
});

const threadingR2 = revise(threadingR1, {
  parts: [...threadingR1.parts, part('belt', 'flat belt 78 mm x 4 mm x 0.5 mm', { notes: 'reel drive belt; perishes at the same time' })],
  editSummary: 'Added the reel drive belt: it is always perished by the time the threading belt goes.',
  author: 'tech-mina',
  proofer: 'moderator',
});

const audioHead = rev({
  title: 'Sound muffled or missing on playback of mono tapes',
  symptoms: ['muffled sound', 'no sound on playback', 'audio drops in and out'],
  cause:
    'Linear audio is read by the audio/control head after the drum. Oxide on its face, or a head knocked out of height, lets the tape ride off the audio track. Dull treble points to dirt; a level that wavers points to height or azimuth.',
  body: doc(
    p(
      'Hi-fi sound comes from the drum, so a TV-825K playing a hi-fi tape may sound fine while mono tapes are muffled: switch the audio output to mono to hear this fault.',
    ),
    steps(
      'Unplug the unit, remove the top cover and clean the audio/control head face with isopropyl alcohol on a chamois stick.',
      'Play a mono recording made on a known-good machine and listen on the mono output.',
      'If the treble is still dull, look at the tape edge at the head: it should run flat between the guides, not curl over the top.',
      'Adjust the azimuth screw (the one with the spring under it, nearest the drum) by small amounts for the brightest, steadiest sound; mark its position first.',
    ),
    reading({
      testPoint: 'Audio line out, playing a 1 kHz test tape',
      expected: 'about 0 dBu, steady within 1 dB',
      measured: '-10 dBu and wavering',
      note: 'Use the mono output; a wavering reading after cleaning means height or azimuth.',
    }),
  ),
  difficulty: 'skilled',
  timeMinutes: 40,
  editSummary: 'First write-up.',
  author: 'tech-farid',
  proofer: 'moderator2',
});

const backTension = rev({
  title: 'Flagging on playback: back tension band worn',
  symptoms: ['flagging', 'skew error on playback', 'verticals bend at the top of the screen'],
  cause:
    'Tape tension on the supply side of the TV-5 deck is set by a felt-lined band round the supply reel table, pulled tight by a spring on the tension arm. The felt wears and glazes and the spring tires, so the tape reaches the drum at the wrong tension and the tracks are read with a timing error. The error is largest at the start of each head pass, so the top lines of the picture bend sideways.',
  body: doc(
    caution(
      'spring',
      'The tension arm spring is under load and springs away when unhooked. Wear eye protection and keep a finger over it as you lift it off its post.',
    ),
    steps(
      'Measure the back tension in play with a cassette-type tension gauge (reading below).',
      'Unplug the recorder and remove the top cover and the cassette housing.',
      'Lift the tension band off the supply reel table and look at the felt: shiny, thin or torn felt means a new band.',
      'Clean the reel table rim with isopropyl alcohol; any oil on it gives the same fault.',
      'Fit the new band and hook the spring into the slot that brings the tension into range; the middle slot is the factory setting.',
      'Measure again and play a tape recorded on another machine: the verticals at the top of the picture should stand straight.',
    ),
    reading({
      testPoint: 'Back tension in play, tension gauge cassette',
      expected: '28-38 g·cm',
      measured: '12-15 g·cm',
    }),
  ),
  parts: [part('mechanical', 'back tension band with felt lining', { notes: 'TV-5 supply side' })],
  difficulty: 'careful',
  timeMinutes: 45,
  editSummary: 'First write-up.',
  author: 'tech-ansel',
  proofer: 'moderator2',
});

export const vcrTapePathFixes: DemoFix[] = [
  {
    slug: 'vhs-snowy-playback-clogged-heads',
    machines: ['quillmere/VR-3100/PAL', 'quillmere/VR-3100/NTSC', 'tamberlyn/TV-820/PAL'],
    chassis: [],
    revisions: [headsR1, headsR2],
  },
  { slug: 'hb200-threading-ring-stalls', machines: ['halvorin/HB-200/NTSC'], chassis: [], revisions: [threadingR1, threadingR2] },
  {
    slug: 'tv5-muffled-linear-audio',
    machines: ['tamberlyn/TV-825K/PAL', 'tamberlyn/TV-820/PAL'],
    chassis: ['tamberlyn-tv5-deck'],
    revisions: [audioHead],
  },
  {
    slug: 'tv5-picture-top-bends-back-tension',
    machines: ['tamberlyn/TV-825K/PAL', 'tamberlyn/TV-825K/NTSC', 'tamberlyn/TV-820/PAL'],
    chassis: ['tamberlyn-tv5-deck'],
    revisions: [backTension],
  },
];
