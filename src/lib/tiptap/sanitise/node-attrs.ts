// Cleans the attributes of one allowed node: unknown ones removed, known ones bounded, unusable nodes refused.
import { isCautionKind } from '../nodes/caution-kind';
import { readingFields } from '../nodes/reading';
import { allowedNodeAttributes, attributeLengthLimits, numberRanges, quietlyRemovedAttributes, type BodyNodeType } from '../rules';
import type { BodyAttrValue } from '../types';
import { isSafeImageSrc } from '../urls';
import { nameForNote } from './context';
import { boundedString, clampedInteger } from './values';

type Note = (message: string) => void;
type RawAttrs = Record<string, unknown>;
export type AttrsResult = { attrs: Record<string, BodyAttrValue> } | { refuse: string };

/** Notes every attribute that is neither allowed nor one the editor writes on its own. */
export function noteUnknownAttributes(type: string, raw: RawAttrs, allowed: readonly string[], note: Note): void {
  const quiet = quietlyRemovedAttributes[type] ?? [];
  for (const [key, value] of Object.entries(raw)) {
    if (allowed.includes(key) || quiet.includes(key) || value === null || value === undefined) continue;
    note(`attribute ${nameForNote(type)}.${nameForNote(key)} removed`);
  }
}

function pictureAttrs(type: 'image' | 'figure', raw: RawAttrs, note: Note): AttrsResult {
  if (!isSafeImageSrc(raw.src)) return { refuse: `${type} removed: its src is not /media/... or https://...` };
  const alt = boundedString(raw.alt, attributeLengthLimits.alt, `${type}.alt`, note);
  if (alt === '') note(`${type} has no alt text`);
  const attrs: Record<string, BodyAttrValue> = { src: raw.src, alt };
  if (type === 'figure') attrs.caption = boundedString(raw.caption, attributeLengthLimits.caption, 'figure.caption', note);
  if (type === 'image') {
    const title = boundedString(raw.title, attributeLengthLimits.title, 'image.title', note);
    if (title !== '') attrs.title = title;
  }
  return { attrs };
}

function readingAttrs(raw: RawAttrs, note: Note): AttrsResult {
  const attrs: Record<string, BodyAttrValue> = {};
  for (const field of readingFields) {
    attrs[field] = boundedString(raw[field], attributeLengthLimits[field], `reading.${field}`, note);
  }
  if (attrs.testPoint === '' && attrs.expected === '') return { refuse: 'reading removed: no test point and no expected value' };
  return { attrs };
}

/** Spans of 1 are the schema default and are left out, so cells made by the sanitiser and cells read back agree. */
function spanAttrs(type: string, raw: RawAttrs, note: Note): AttrsResult {
  const attrs: Record<string, BodyAttrValue> = {};
  for (const name of ['colspan', 'rowspan'] as const) {
    const span = clampedInteger(raw[name], numberRanges.cellSpan, `${type}.${name}`, note);
    if (span !== 1) attrs[name] = span;
  }
  return { attrs };
}

export function cleanNodeAttrs(type: BodyNodeType, raw: RawAttrs, note: Note): AttrsResult {
  noteUnknownAttributes(type, raw, allowedNodeAttributes[type], note);
  switch (type) {
    case 'heading':
      return { attrs: { level: clampedInteger(raw.level, numberRanges.headingLevel, 'heading.level', note) } };
    case 'orderedList':
      return { attrs: { start: clampedInteger(raw.start, numberRanges.orderedListStart, 'orderedList.start', note) } };
    case 'tableCell':
    case 'tableHeader':
      return spanAttrs(type, raw, note);
    case 'image':
    case 'figure':
      return pictureAttrs(type, raw, note);
    case 'reading':
      return readingAttrs(raw, note);
    case 'caution':
      return isCautionKind(raw.kind)
        ? { attrs: { kind: raw.kind } }
        : { refuse: 'caution with an unknown kind turned into plain paragraphs' };
    default:
      return { attrs: {} };
  }
}
