// SVG shape helpers for the demo illustrations: our own palette and a few primitives.
export const PAPER = '#f6f1e7';
export const INK = '#0f4c4a';
export const AMBER = '#c7861a';

/** Text in an SVG document must not break the markup. */
export function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

const r1 = (n: number): string => String(Math.round(n * 10) / 10);

export function circle(cx: number, cy: number, r: number, style = `fill="none" stroke="${INK}" stroke-width="8"`): string {
  return `<circle cx="${r1(cx)}" cy="${r1(cy)}" r="${r1(r)}" ${style}/>`;
}

export function rect(
  x: number,
  y: number,
  w: number,
  h: number,
  style = `fill="none" stroke="${INK}" stroke-width="8"`,
  radius = 0,
): string {
  return `<rect x="${r1(x)}" y="${r1(y)}" width="${r1(w)}" height="${r1(h)}" rx="${radius}" ${style}/>`;
}

export function line(x1: number, y1: number, x2: number, y2: number, colour = INK, width = 8): string {
  return `<line x1="${r1(x1)}" y1="${r1(y1)}" x2="${r1(x2)}" y2="${r1(y2)}" stroke="${colour}" stroke-width="${width}" stroke-linecap="round"/>`;
}

export function path(d: string, style = `fill="none" stroke="${INK}" stroke-width="8"`): string {
  return `<path d="${d}" ${style} stroke-linejoin="round" stroke-linecap="round"/>`;
}

/** A label with a thin leader line from the edge of the text nearest the thing it names. */
export function label(text: string, x: number, y: number, toX?: number, toY?: number): string {
  let leader = '';
  if (toX !== undefined && toY !== undefined) {
    const halfWidth = text.length * 11;
    if (toY < y - 60) leader = line(x, y - 46, toX, toY, INK, 3);
    else if (toY > y + 30) leader = line(x, y + 14, toX, toY, INK, 3);
    else leader = line(toX < x ? x - halfWidth - 10 : x + halfWidth + 10, y - 14, toX, toY, INK, 3);
  }
  return `${leader}<text x="${r1(x)}" y="${r1(y)}" font-family="Georgia, serif" font-size="44" fill="${INK}" text-anchor="middle">${escapeXml(text)}</text>`;
}

/** A spur gear outline with square-ish teeth, as a closed polygon. */
export function gear(cx: number, cy: number, radius: number, teeth: number, colour = INK): string {
  const points: string[] = [];
  const depth = Math.max(14, radius * 0.12);
  for (let i = 0; i < teeth * 4; i++) {
    const angle = (i / (teeth * 4)) * Math.PI * 2;
    const r = i % 4 < 2 ? radius : radius - depth;
    points.push(`${r1(cx + r * Math.cos(angle))},${r1(cy + r * Math.sin(angle))}`);
  }
  return `<polygon points="${points.join(' ')}" fill="none" stroke="${colour}" stroke-width="7" stroke-linejoin="round"/>${circle(cx, cy, radius * 0.18)}`;
}

/** A curved arrow along a circle, showing which way a part turns. */
export function turnArrow(cx: number, cy: number, r: number, fromDeg: number, toDeg: number): string {
  const at = (deg: number): [number, number] => [cx + r * Math.cos((deg * Math.PI) / 180), cy + r * Math.sin((deg * Math.PI) / 180)];
  const [x1, y1] = at(fromDeg);
  const [x2, y2] = at(toDeg);
  const large = Math.abs(toDeg - fromDeg) > 180 ? 1 : 0;
  const head = at(toDeg - 8);
  return (
    path(`M ${r1(x1)} ${r1(y1)} A ${r} ${r} 0 ${large} 1 ${r1(x2)} ${r1(y2)}`, `fill="none" stroke="${AMBER}" stroke-width="10"`) +
    circle(head[0], head[1], 4, `fill="${AMBER}"`) +
    circle(x2, y2, 16, `fill="${AMBER}"`)
  );
}

/** The outer path of a belt wrapped round two pulleys (external tangents). */
export function beltPath(x1: number, y1: number, ra: number, x2: number, y2: number, rb: number): string {
  const dx = x2 - x1;
  const dy = y2 - y1;
  const d = Math.hypot(dx, dy);
  const theta = Math.atan2(dy, dx);
  const alpha = Math.acos((ra - rb) / d);
  const pt = (x: number, y: number, r: number, a: number): string => `${r1(x + r * Math.cos(a))} ${r1(y + r * Math.sin(a))}`;
  const a1 = theta + alpha;
  const a2 = theta - alpha;
  return `M ${pt(x1, y1, ra, a1)} L ${pt(x2, y2, rb, a1)} A ${rb} ${rb} 0 1 0 ${pt(x2, y2, rb, a2)} L ${pt(x1, y1, ra, a2)} A ${ra} ${ra} 0 0 0 ${pt(x1, y1, ra, a1)} Z`;
}
