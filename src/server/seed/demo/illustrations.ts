// Our own SVG drawings for demo revisions: a fixed frame, a title and one drawing per key.
import { drawBleedResistor, drawBulgingCapacitor, drawLaserLens } from './illustration-drawings-electrical';
import { drawBeltPath, drawIdlerTyre, drawModeSwitch, drawPinchRoller, drawTrayGear } from './illustration-drawings-mechanical';
import { AMBER, INK, PAPER, escapeXml } from './illustration-shapes';

interface Drawing {
  title: string;
  draw: () => string;
}

const drawings: Record<string, Drawing> = {
  'belt-path': { title: 'Belt path: motor pulley to flywheel', draw: drawBeltPath },
  'idler-tyre': { title: 'Idler tyre between the reel tables', draw: drawIdlerTyre },
  'bulging-capacitor': { title: 'Electrolytic capacitor beside a heatsink', draw: drawBulgingCapacitor },
  'tray-gear': { title: 'Loading gear train and timing mark', draw: drawTrayGear },
  'laser-lens': { title: 'Optical pickup and its lens', draw: drawLaserLens },
  'mode-switch': { title: 'Rotary mode switch and its contacts', draw: drawModeSwitch },
  'bleed-resistor': { title: 'Bleed resistor across a capacitor', draw: drawBleedResistor },
  'pinch-roller': { title: 'Pinch roller against the capstan', draw: drawPinchRoller },
};

export const illustrationKeys: string[] = Object.keys(drawings);

const WIDTH = 1600;
const HEIGHT = 1200;

/** A standalone SVG document for one key; an unknown key is a programming error and says which keys exist. */
export function drawIllustration(key: string): string {
  const drawing = drawings[key];
  if (!drawing) {
    throw new Error(`No illustration called "${key}". Known drawings: ${illustrationKeys.join(', ')}.`);
  }
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${WIDTH} ${HEIGHT}" width="${WIDTH}" height="${HEIGHT}" role="img">`,
    `<title>${escapeXml(drawing.title)}</title>`,
    `<rect x="0" y="0" width="${WIDTH}" height="${HEIGHT}" fill="${PAPER}"/>`,
    `<rect x="24" y="24" width="${WIDTH - 48}" height="${HEIGHT - 48}" fill="none" stroke="${INK}" stroke-width="4"/>`,
    `<text x="60" y="110" font-family="Georgia, serif" font-size="56" font-weight="bold" fill="${INK}">${escapeXml(drawing.title)}</text>`,
    drawing.draw(),
    `<rect x="${WIDTH - 330}" y="${HEIGHT - 110}" width="290" height="70" fill="${AMBER}" rx="10"/>`,
    `<text x="${WIDTH - 185}" y="${HEIGHT - 60}" font-family="Georgia, serif" font-size="40" fill="${PAPER}" text-anchor="middle">Illustration</text>`,
    '</svg>',
  ].join('\n');
}
