// sanitiseBody: the one gate raw body JSON passes before it is stored or rendered.
import type { BodyDoc } from '../types';
import { BodyLimitError, SanitiseContext } from './context';
import { cleanChildren, fitContent, rawNodeSchema } from './walk';

export type SanitiseBodyResult = { doc: BodyDoc; dropped: string[] } | { error: string };

const notADocument = 'The body must be a JSON object of type "doc".';

/**
 * Validates and cleans a Tiptap JSON body. Unknown nodes, marks and attributes are removed (notes in `dropped`);
 * a body that is not a document, or passes the depth, node or text limits, is refused with `error`. Never throws.
 */
export function sanitiseBody(json: unknown): SanitiseBodyResult {
  const ctx = new SanitiseContext();
  try {
    const root = rawNodeSchema.safeParse(json);
    if (!root.success || root.data.type !== 'doc') return { error: notADocument };
    ctx.visit(0);
    const content = fitContent('doc', cleanChildren(root.data.content, 1, ctx), ctx) ?? [];
    return { doc: { type: 'doc', content }, dropped: ctx.droppedNotes() };
  } catch (error) {
    if (error instanceof BodyLimitError) return { error: error.message };
    // Hostile objects (throwing getters, proxies) end here rather than in the caller.
    return { error: 'The body could not be read.' };
  }
}
