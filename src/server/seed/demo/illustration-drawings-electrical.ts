// Drawings of electrical and optical parts for the demo illustrations: capacitors, resistors, pickups.
import { AMBER, INK, PAPER, circle, label, line, path, rect } from './illustration-shapes';

/** A standing electrolytic capacitor drawn from the side: can, sleeve stripe, leads below or above. */
function capacitorCan(x: number, y: number, w: number, h: number, domed: boolean, leadsUp = false): string {
  const top = domed
    ? path(`M ${x} ${y} Q ${x + w / 2} ${y - 90} ${x + w} ${y}`, `fill="none" stroke="${AMBER}" stroke-width="10"`)
    : line(x, y, x + w, y);
  const leadFrom = leadsUp ? y : y + h;
  const leadTo = leadsUp ? y - 120 : y + h + 120;
  return [
    line(x, y, x, y + h),
    line(x + w, y, x + w, y + h),
    line(x, y + h, x + w, y + h),
    top,
    rect(x + w - 60, y + 20, 36, h - 40, `fill="${INK}" fill-opacity="0.25" stroke="none"`),
    line(x + w * 0.3, leadFrom, x + w * 0.3, leadTo, INK, 6),
    line(x + w * 0.7, leadFrom, x + w * 0.7, leadTo, INK, 6),
  ].join('');
}

export function drawBulgingCapacitor(): string {
  const fins = Array.from({ length: 7 }, (_, i) => rect(200 + i * 60, 300, 30, 560, `fill="none" stroke="${INK}" stroke-width="6"`)).join(
    '',
  );
  const waves = [0, 1, 2]
    .map((i) => path(`M ${310 + i * 80} 270 q 20 -30 0 -60 q -20 -30 0 -60`, `fill="none" stroke="${AMBER}" stroke-width="6"`))
    .join('');
  return [
    fins,
    rect(180, 860, 460, 40, `fill="none" stroke="${INK}" stroke-width="8"`),
    line(120, 1000, 1480, 1000, INK, 10),
    capacitorCan(820, 480, 260, 400, true),
    capacitorCan(1200, 560, 180, 320, false),
    waves,
    label('Regulator heatsink', 410, 965),
    label('Domed top: failed', 950, 300, 950, 400),
    label('Good: flat top', 1290, 460),
    label('Negative stripe', 1000, 1090, 1045, 900),
  ].join('');
}

export function drawBleedResistor(): string {
  const zigzag = `M 560 300 ${Array.from({ length: 12 }, (_, i) => `l 40 ${i % 2 === 0 ? -40 : 40}`).join(' ')}`;
  return [
    capacitorCan(560, 640, 480, 340, false, true),
    path(zigzag, `fill="none" stroke="${AMBER}" stroke-width="10"`),
    line(560, 300, 704, 500, INK, 6),
    line(1040, 300, 896, 500, INK, 6),
    rect(674, 490, 60, 40, `fill="${INK}"`, 8),
    rect(866, 490, 60, 40, `fill="${INK}"`, 8),
    rect(1240, 600, 260, 160, `fill="${PAPER}" stroke="${INK}" stroke-width="8"`, 16),
    `<text x="1370" y="700" font-family="monospace" font-size="56" fill="${INK}" text-anchor="middle">0.4 V</text>`,
    line(1240, 650, 926, 510, INK, 3),
    line(1240, 710, 704, 530, INK, 3),
    label('Bleed resistor in insulated clips', 800, 210),
    label('Reservoir capacitor', 800, 1060),
    label('Measure, do not assume', 1300, 840),
  ].join('');
}

export function drawLaserLens(): string {
  return [
    line(160, 380, 1440, 380, INK, 12),
    line(160, 860, 1440, 860, INK, 12),
    rect(540, 320, 520, 600, `fill="none" stroke="${INK}" stroke-width="8"`, 30),
    circle(800, 560, 130),
    circle(800, 560, 90, `fill="${INK}" fill-opacity="0.15" stroke="${INK}" stroke-width="6"`),
    circle(770, 530, 22, `fill="${PAPER}" stroke="none"`),
    circle(840, 600, 10, `fill="${AMBER}"`),
    rect(1060, 620, 300, 60, `fill="none" stroke="${AMBER}" stroke-width="8"`),
    path('M 800 780 L 760 850 L 840 850 Z', `fill="none" stroke="${AMBER}" stroke-width="8"`),
    label('Guide rods', 300, 340),
    label('Objective lens', 800, 250, 800, 420),
    label('Dust on the lens', 1240, 520, 855, 600),
    label('Flex cable', 1210, 760),
    label('Pickup on its sled', 800, 1010),
  ].join('');
}
