// Cleans the marks of one text node: allowed types only, safe link targets only, no duplicates.
import { z } from 'zod';
import { allowedMarkAttributes, isAllowedMarkType } from '../rules';
import type { BodyMark } from '../types';
import { isSafeLinkHref } from '../urls';
import { nameForNote } from './context';
import { noteUnknownAttributes } from './node-attrs';

type Note = (message: string) => void;

const rawMarkSchema = z.object({
  type: z.string().min(1).max(64),
  attrs: z.record(z.string(), z.unknown()).nullish(),
});

function cleanMark(raw: unknown, note: Note): BodyMark | null {
  const parsed = rawMarkSchema.safeParse(raw);
  if (!parsed.success) {
    note('malformed mark removed');
    return null;
  }
  const { type } = parsed.data;
  const attrs = parsed.data.attrs ?? {};
  if (!isAllowedMarkType(type)) {
    note(`mark ${nameForNote(type)} removed`);
    return null;
  }
  noteUnknownAttributes(type, attrs, allowedMarkAttributes[type], note);
  if (type !== 'link') return { type };
  if (!isSafeLinkHref(attrs.href)) {
    note('link removed: its href is not http, https or mailto');
    return null;
  }
  return { type, attrs: { href: attrs.href } };
}

export function cleanMarks(raw: unknown, note: Note): BodyMark[] {
  if (raw === undefined || raw === null) return [];
  if (!Array.isArray(raw)) {
    note('malformed mark list removed');
    return [];
  }
  const byType = new Map<string, BodyMark>();
  for (const rawMark of raw) {
    const mark = cleanMark(rawMark, note);
    if (mark && !byType.has(mark.type)) byType.set(mark.type, mark);
  }
  const code = byType.get('code');
  // Inline code excludes every other mark in the editor's schema.
  if (code && byType.size > 1) {
    note('marks on inline code removed');
    return [code];
  }
  return [...byType.values()];
}
