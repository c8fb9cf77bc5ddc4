// Word families for search: the different ways technicians type the same fault, part or action.
export interface DemoWordFamily {
  name: string;
  terms: string[];
}

export const demoWordFamilies: DemoWordFamily[] = [
  { name: 'tray', terms: ['tray', 'drawer', 'loader', 'disc tray', 'disc drawer'] },
  { name: 'negation', terms: ["won't", 'will not', "doesn't", 'does not', 'fails to', "can't", 'cannot'] },
  { name: 'tape damage', terms: ['chews', 'eats', 'mangles', 'creases', 'crinkles', 'spills tape'] },
  { name: 'no picture', terms: ['no picture', 'blank screen', 'black screen', 'no video', 'no image'] },
  { name: 'snowy picture', terms: ['snowy', 'snow', 'noise bars', 'interference', 'noisy picture'] },
  { name: 'rewind', terms: ['rewind', 'rew', 'rewinding', 'rewinds'] },
  { name: 'fast forward', terms: ['fast forward', 'ff', 'fast-forward', 'fwd', 'cue'] },
  { name: 'belt', terms: ['belt', 'drive belt', 'rubber band', 'loading belt'] },
  { name: 'idler', terms: ['idler', 'idler tyre', 'idler tire', 'idler wheel', 'idler gear'] },
  { name: 'capacitor', terms: ['capacitor', 'cap', 'electrolytic', 'condenser', 'e-cap'] },
  { name: 'laser pickup', terms: ['laser', 'pickup', 'optical pickup', 'lens', 'OPU', 'optical block'] },
  { name: 'disc not read', terms: ["won't read", 'no disc', 'disc error', 'cannot read', 'unreadable disc'] },
  { name: 'eject', terms: ['eject', 'unload', 'open', 'ejects'] },
  { name: 'power supply', terms: ['power supply', 'PSU', 'SMPS', 'power board', 'switch-mode supply'] },
  { name: 'no power', terms: ['no power', 'dead', 'will not turn on', 'no standby light', 'not powering up'] },
  { name: 'slow start', terms: ['slow start', 'slow to start', 'takes ages to turn on', 'long boot', 'stuck on hello'] },
  { name: 'clicking', terms: ['clicking', 'ticking', 'chirping', 'tick tick', 'relay clicking'] },
  { name: 'display', terms: ['display', 'VFD', 'front panel display', 'clock display', 'fluorescent display'] },
  { name: 'dim display', terms: ['dim', 'faint', 'fading', 'flickering display', 'hard to read'] },
  { name: 'pinch roller', terms: ['pinch roller', 'pressure roller', 'pinch wheel', 'capstan roller'] },
  { name: 'capstan', terms: ['capstan', 'capstan motor', 'capstan shaft', 'capstan flywheel'] },
  { name: 'video heads', terms: ['video heads', 'head drum', 'drum', 'heads', 'upper drum', 'scanner'] },
  { name: 'head cleaning', terms: ['head cleaning', 'clean heads', 'clogged heads', 'head clog', 'dirty heads'] },
  { name: 'mode switch', terms: ['mode switch', 'cam switch', 'position switch', 'mechanism switch'] },
  { name: 'wow and flutter', terms: ['wow', 'flutter', 'wow and flutter', 'pitch wobble', 'warble'] },
  { name: 'speed drift', terms: ['speed drift', 'plays fast', 'plays slow', 'wrong speed', 'pitch drift'] },
  { name: 'demagnetise', terms: ['demagnetise', 'demagnetize', 'degauss', 'demag'] },
  { name: 'spindle motor', terms: ['spindle', 'spindle motor', 'disc motor', 'turntable motor'] },
  { name: 'condensation', terms: ['condensation', 'dew', 'moisture', 'humidity lockout'] },
  { name: 'cassette door', terms: ['cassette door', 'cassette compartment', 'tape door', 'cassette lid', 'cassette housing'] },
  { name: 'skipping', terms: ['skips', 'skipping', 'jumps', 'stutters', 'mistracks'] },
  { name: 'hum', terms: ['hum', 'buzz', 'mains hum', 'drone'] },
  { name: 'error code', terms: ['error code', 'error', 'err', 'fault code'] },
  { name: 'finalise', terms: ['finalise', 'finalize', 'finalising', 'close disc'] },
  { name: 'reservoir capacitor', terms: ['reservoir capacitor', 'filter capacitor', 'smoothing capacitor', 'main cap', 'bulk capacitor'] },
  { name: 'fuse', terms: ['fuse', 'blown fuse', 'fuse blown', 'fuse open'] },
];
