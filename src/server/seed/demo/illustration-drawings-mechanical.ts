// Drawings of mechanical parts for the demo illustrations: belts, idlers, gears, switches, rollers.
import { AMBER, INK, PAPER, beltPath, circle, gear, label, line, path, rect, turnArrow } from './illustration-shapes';

export function drawBeltPath(): string {
  const motor = { x: 430, y: 700, r: 70 };
  const fly = { x: 1080, y: 600, r: 260 };
  const spokes = [0, 60, 120, 180, 240, 300]
    .map((deg) => {
      const a = (deg * Math.PI) / 180;
      return line(fly.x + 50 * Math.cos(a), fly.y + 50 * Math.sin(a), fly.x + 220 * Math.cos(a), fly.y + 220 * Math.sin(a), INK, 6);
    })
    .join('');
  return [
    path(beltPath(motor.x, motor.y, motor.r + 10, fly.x, fly.y, fly.r + 10), `fill="none" stroke="${AMBER}" stroke-width="14"`),
    circle(motor.x, motor.y, motor.r),
    circle(motor.x, motor.y, 14, `fill="${INK}"`),
    rect(motor.x - 110, motor.y + 110, 220, 150, `fill="none" stroke="${INK}" stroke-width="8"`, 20),
    circle(fly.x, fly.y, fly.r),
    circle(fly.x, fly.y, 50),
    spokes,
    turnArrow(fly.x, fly.y, fly.r + 60, -30, 30),
    label('Motor pulley', motor.x, 420, motor.x, motor.y - motor.r - 20),
    label('Motor', motor.x, motor.y + 340),
    label('Flywheel', fly.x, 1010, fly.x, fly.y + fly.r + 20),
    label('Belt: clean both rims', 760, 260, 760, 500),
  ].join('');
}

export function drawIdlerTyre(): string {
  const cracks = [200, 230, 260]
    .map((deg) => {
      const a = (deg * Math.PI) / 180;
      return line(800 + 72 * Math.cos(a), 800 + 72 * Math.sin(a), 800 + 96 * Math.cos(a), 800 + 96 * Math.sin(a), AMBER, 6);
    })
    .join('');
  return [
    circle(400, 640, 220),
    circle(400, 640, 60),
    circle(1200, 640, 220),
    circle(1200, 640, 60),
    circle(800, 800, 100, `fill="none" stroke="${AMBER}" stroke-width="24"`),
    circle(800, 800, 70),
    circle(800, 800, 14, `fill="${INK}"`),
    cracks,
    line(800, 800, 800, 1030, INK, 12),
    circle(800, 1040, 20, `fill="${PAPER}" stroke="${INK}" stroke-width="8"`),
    label('Supply reel table', 400, 340),
    label('Take-up reel table', 1200, 340),
    label('Idler tyre: glazed, cracked', 420, 1010, 710, 850),
    label('Arm pivot', 1060, 1055, 825, 1040),
  ].join('');
}

export function drawTrayGear(): string {
  const teeth = Array.from({ length: 14 }, (_, i) => rect(240 + i * 80, 930, 40, 34, `fill="none" stroke="${INK}" stroke-width="6"`)).join(
    '',
  );
  return [
    gear(420, 560, 170, 18),
    gear(720, 700, 110, 12),
    gear(1000, 760, 150, 16, AMBER),
    rect(220, 964, 1160, 60, `fill="none" stroke="${INK}" stroke-width="8"`),
    teeth,
    circle(1000, 660, 16, `fill="${AMBER}"`),
    path('M 1000 930 L 980 900 L 1020 900 Z', `fill="${AMBER}" stroke="${AMBER}" stroke-width="4"`),
    line(1000, 676, 1000, 900, AMBER, 4),
    label('Motor gear', 420, 340),
    label('Idler gear', 720, 520),
    label('Cam gear: mark points down', 1180, 500, 1010, 650),
    label('Tray rack', 800, 1100),
  ].join('');
}

export function drawModeSwitch(): string {
  const arc = (r: number, from: number, to: number): string => {
    const at = (deg: number): string => `${800 + r * Math.cos((deg * Math.PI) / 180)} ${620 + r * Math.sin((deg * Math.PI) / 180)}`;
    return path(`M ${at(from)} A ${r} ${r} 0 ${to - from > 180 ? 1 : 0} 1 ${at(to)}`, `fill="none" stroke="${INK}" stroke-width="16"`);
  };
  return [
    circle(800, 620, 340),
    arc(280, 10, 130),
    arc(280, 160, 300),
    arc(220, 40, 200),
    arc(220, 230, 340),
    arc(160, 0, 250),
    line(800, 620, 800 + 300 * Math.cos(-0.9), 620 + 300 * Math.sin(-0.9), AMBER, 10),
    line(800, 620, 800 + 240 * Math.cos(-0.8), 620 + 240 * Math.sin(-0.8), AMBER, 10),
    circle(800, 620, 30, `fill="${INK}"`),
    circle(800, 300, 14, `fill="${AMBER}"`),
    path('M 800 250 L 780 215 L 820 215 Z', `fill="${INK}"`),
    label('Alignment dot and triangle', 800, 170),
    label('Contact tracks', 260, 1040, 560, 800),
    label('Wiper fingers', 1320, 420, 1010, 400),
  ].join('');
}

export function drawPinchRoller(): string {
  return [
    line(120, 620, 1480, 620, AMBER, 10),
    circle(820, 560, 40, `fill="${INK}"`),
    circle(820, 760, 130),
    circle(820, 760, 40),
    path('M 730 670 A 130 130 0 0 1 910 670', `fill="none" stroke="${AMBER}" stroke-width="16"`),
    line(820, 760, 1160, 960, INK, 14),
    circle(1160, 960, 24, `fill="${PAPER}" stroke="${INK}" stroke-width="8"`),
    path('M 980 860 l 20 -30 l 20 30 l 20 -30 l 20 30 l 20 -30 l 20 30', `fill="none" stroke="${INK}" stroke-width="6"`),
    label('Capstan', 820, 450, 820, 520),
    label('Tape', 260, 590),
    label('Pinch roller: hard, glossy surface', 560, 1040, 740, 880),
    label('Arm pivot and spring', 1300, 760, 1100, 850),
  ].join('');
}
