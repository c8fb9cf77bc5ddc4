// Demo fixes for CD players: tray drive, the power supply and the line outputs.
import type { DemoFix } from '../types';
import { cap, caution, doc, figure, p, part, reading, rev, steps } from './build';

const tray = rev({
  title: 'Tray opens then closes by itself, or stops halfway',
  symptoms: ['tray opens then closes', 'tray stops halfway', 'drawer will not stay open'],
  cause:
    'The KL-9 drawer is driven by a small square belt from the loading motor. When the belt stretches the drawer slows near the end of its travel, misses the open switch in time, and the controller closes it again.',
  body: doc(
    p('Unplug the player and remove the top cover.'),
    steps(
      'Open the drawer by turning the white pulley under the loader by hand.',
      'Lift the old belt off the motor pulley and the loader pulley.',
      'Clean the pulley grooves with isopropyl alcohol and fit the new belt.',
      'Test the drawer twenty times with and without a disc.',
    ),
  ),
  parts: [part('belt', 'square belt 1.2 mm section, 32 mm inside diameter', { notes: 'KL-9 drawer belt' })],
  difficulty: 'routine',
  timeMinutes: 20,
  editSummary: 'First write-up.',
  author: 'tech-greta',
  proofer: 'moderator',
});

const fuse = rev({
  title: 'Dead after a power cut, internal fuse blown',
  symptoms: ['dead', 'no display', 'fuse blown', 'died after a storm'],
  cause:
    'The CP-760 has a linear supply with a large reservoir capacitor after a bridge rectifier. A surge on the supply can short one diode of the bridge; the fuse then blows again the moment it is replaced.',
  body: doc(
    caution('mains', 'The CP-760 fuse holder and transformer primary are at mains voltage; the fuse holder has no cover.'),
    caution(
      'stored_charge',
      'The reservoir capacitor C501 (10000uF 25V) can hold its charge for a long time when the fuse has blown; the energy can burn a tool or a track. Discharge it through a 100 ohm 5 W resistor and measure before working.',
    ),
    steps(
      'Unplug the player, remove the top cover and discharge C501 as above.',
      'Test each diode of the bridge rectifier D501 in diode-test mode.',
      'Replace a shorted bridge with one of the same current and voltage rating, and check C501 for a domed top or leakage.',
      'Fit a new fuse of the rating printed beside the holder, never a larger one.',
      'Power up through a series lamp the first time.',
    ),
    reading({
      testPoint: 'Each diode of D501, diode-test mode',
      expected: '0.5-0.7 V one way, open the other',
      measured: 'near 0 V both ways on one diode',
    }),
  ),
  parts: [
    part('diode', 'bridge rectifier 4 A 200 V', { ref: 'D501' }),
    part('fuse', 'T1.6A', { ref: 'F501', rating: '250V, 5 x 20 mm, time-lag' }),
    cap('C501', '10000uF', '25V 105C', 'only if domed or leaking; snap-in 30 mm'),
  ],
  difficulty: 'skilled',
  timeMinutes: 50,
  editSummary: 'First write-up.',
  author: 'tech-jonah',
  proofer: 'moderator2',
  illustrations: [
    figure(
      'bleed-resistor',
      'Drawing of a resistor bridging the leads of a large capacitor, with a meter reading across it.',
      'Discharging C501 through a bleed resistor before testing the bridge.',
    ),
  ],
});

const mutingRelay = rev({
  title: 'One channel missing or intermittent: output muting relay contacts',
  symptoms: ['one channel dead', 'intermittent right channel', 'scratchy output on one side'],
  cause:
    'The CP-760 mutes its line outputs at switch-on and between tracks with a small sealed relay after the output stage. Its contacts carry almost no current, so they never wipe themselves clean and one pair tarnishes into a high resistance. The channel then fades or comes and goes, and tapping the relay changes it.',
  body: doc(
    caution(
      'mains',
      'The CP-760 transformer primary and fuse holder are exposed with the cover off. Take the relay readings with the player unplugged, and keep clear of the primary side when testing it powered.',
    ),
    steps(
      'Swap the left and right leads at the amplifier: if the fault moves to the other speaker, it is in the player.',
      'Unplug the player, remove the top cover and find RL601 beside the output sockets.',
      'Measure the contact resistance of each pole with the relay energised from a bench supply (reading below).',
      'Replace the relay with a sealed one of the same coil voltage and pin-out; cleaning the contacts of a sealed relay does not last.',
      'Play a disc with a test tone on both channels and check that both outputs match within 0.5 dB.',
    ),
    reading({
      testPoint: 'RL601 contacts, each pole, coil fed 12 V from a bench supply',
      expected: 'under 0.1 Ω',
      measured: '5-200 Ω and wandering on the right channel pole',
    }),
  ),
  parts: [part('switch', 'relay 12 V coil, 2 changeover contacts, sealed', { ref: 'RL601', notes: 'signal relay, gold-clad contacts' })],
  difficulty: 'careful',
  timeMinutes: 35,
  editSummary: 'First write-up.',
  author: 'tech-farid',
  proofer: 'moderator2',
});

export const cdPlayerPowerFixes: DemoFix[] = [
  {
    slug: 'kl9-drawer-opens-then-closes',
    machines: ['kestrune/CP-720/multi', 'kestrune/CP-740/multi', 'kestrune/CP-760/multi'],
    chassis: ['kestrune-kl9-transport'],
    revisions: [tray],
  },
  { slug: 'cp760-dead-fuse-blown-bridge', machines: ['kestrune/CP-760/multi'], chassis: [], revisions: [fuse] },
  { slug: 'cp760-one-channel-silent-muting-relay', machines: ['kestrune/CP-760/multi'], chassis: [], revisions: [mutingRelay] },
];
