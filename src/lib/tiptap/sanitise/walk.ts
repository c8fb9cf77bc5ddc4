// Walks raw body JSON node by node, keeping what the allowlist permits and reshaping it to fit the schema.
import { z } from 'zod';
import { bodyLimits, isAllowedNodeType, leafNodeTypes, removedWithContentNodeTypes, type BodyNodeType } from '../rules';
import type { BodyNode } from '../types';
import { nameForNote, type SanitiseContext } from './context';
import {
  nonEmptyBlocks,
  toBlocks,
  toCells,
  toCodeText,
  toInline,
  toListItems,
  toParagraphs,
  toRows,
  withLeadingParagraph,
} from './fit-content';
import { cleanMarks } from './marks';
import { cleanNodeAttrs } from './node-attrs';
import { withoutControlCharacters } from './values';

/** One node, read shallowly: children are checked one by one as the walk reaches them. */
export const rawNodeSchema = z.object({
  type: z.string().min(1).max(bodyLimits.maxTypeNameLength),
  attrs: z.record(z.string(), z.unknown()).nullish(),
  content: z.array(z.unknown()).nullish(),
  marks: z.array(z.unknown()).nullish(),
  text: z.unknown().optional(),
});
type RawNode = z.infer<typeof rawNodeSchema>;

function cleanText(raw: RawNode, ctx: SanitiseContext): BodyNode[] {
  if (typeof raw.text !== 'string') {
    ctx.note('text node without text removed');
    return [];
  }
  const text = withoutControlCharacters(raw.text);
  if (text === '') return [];
  ctx.addText(text.length);
  const marks = cleanMarks(raw.marks, ctx.note);
  return [marks.length > 0 ? { type: 'text', text, marks } : { type: 'text', text }];
}

/** Unknown nodes are unwrapped so their text survives, except those whose content is code or markup. */
function cleanUnknown(raw: RawNode, depth: number, ctx: SanitiseContext): BodyNode[] {
  const typeName = nameForNote(raw.type);
  if (removedWithContentNodeTypes.includes(raw.type.toLowerCase())) {
    ctx.note(`node ${typeName} removed with its content`);
    return [];
  }
  ctx.note(`node ${typeName} removed, its text kept`);
  return cleanChildren(raw.content, depth + 1, ctx);
}

/** Fits children to the parent type; null means the parent is left with nothing worth keeping. */
export function fitContent(type: BodyNodeType, children: BodyNode[], ctx: SanitiseContext): BodyNode[] | null {
  switch (type) {
    case 'paragraph':
    case 'heading':
      return toInline(children, ctx.note);
    case 'codeBlock':
      return toCodeText(children);
    case 'doc':
    case 'blockquote':
    case 'tableCell':
    case 'tableHeader':
      return nonEmptyBlocks(toBlocks(children));
    case 'listItem':
      return withLeadingParagraph(toBlocks(children));
    case 'caution':
      return nonEmptyBlocks(toParagraphs(children, ctx.note));
    case 'bulletList':
    case 'orderedList':
      return emptyToNull(toListItems(children));
    case 'table':
      return emptyToNull(toRows(children));
    case 'tableRow':
      return emptyToNull(toCells(children));
    default:
      return [];
  }
}

function emptyToNull(nodes: BodyNode[]): BodyNode[] | null {
  return nodes.length > 0 ? nodes : null;
}

function cleanNode(rawInput: unknown, depth: number, ctx: SanitiseContext): BodyNode[] {
  ctx.visit(depth);
  const parsed = rawNodeSchema.safeParse(rawInput);
  if (!parsed.success) {
    ctx.note('malformed node removed');
    return [];
  }
  const raw = parsed.data;
  if (raw.type === 'text') return cleanText(raw, ctx);
  if (!isAllowedNodeType(raw.type) || raw.type === 'doc') return cleanUnknown(raw, depth, ctx);
  const type: BodyNodeType = raw.type;
  const attrsResult = cleanNodeAttrs(type, raw.attrs ?? {}, ctx.note);
  if ('refuse' in attrsResult) {
    ctx.note(attrsResult.refuse);
    // A caution of unknown kind keeps its words as plain paragraphs; other refused nodes have none.
    return type === 'caution' ? cleanChildren(raw.content, depth + 1, ctx) : [];
  }
  const node: BodyNode = { type };
  if (Object.keys(attrsResult.attrs).length > 0) node.attrs = attrsResult.attrs;
  if (leafNodeTypes.includes(type)) return [node];
  const content = fitContent(type, cleanChildren(raw.content, depth + 1, ctx), ctx);
  if (content === null) {
    ctx.note(`empty ${type} removed`);
    return [];
  }
  if (content.length > 0) node.content = content;
  return [node];
}

export function cleanChildren(content: unknown[] | null | undefined, depth: number, ctx: SanitiseContext): BodyNode[] {
  if (!content) return [];
  return content.flatMap((child) => cleanNode(child, depth, ctx));
}
