// renderFixBody: the one way a stored fix body becomes HTML. Sanitises, renders without a DOM, never throws.
import { getSchema } from '@tiptap/core';
import type { Mark as PMMark, Node as PMNode, Schema } from '@tiptap/pm/model';
import { renderJSONContentToString } from '@tiptap/static-renderer/json/html-string';
import { domOutputSpecToHTMLString, renderToElement, serializeChildrenToHTMLString } from '@tiptap/static-renderer/pm/html-string';
import { sanitiseBody } from '@/lib/tiptap/allowlist';
import { bodyExtensions } from '@/lib/tiptap/extensions';
import { cautionHtml, cautionPointerHtml, figureHtml, imageHtml, readingHtml } from './body-node-html';
import { linkHtml, textHtml } from './inline-html';
import { tableCellHtml, tableHeaderHtml, tableHtml, tableRowHtml } from './table-html';

export interface FixBodyHtml {
  html: string;
  /** False when the body could not be read or rendered and `html` is the placeholder block. */
  ok: boolean;
}

export interface RenderFixBodyOptions {
  /** Told why a body fell back to the placeholder, so the caller can log it. */
  onFailure?: (reason: string) => void;
  /** The page shows every caution in full before the remedy: the remedy's own cautions become links to them. */
  cautionsShownAbove?: boolean;
}

export const renderFailedHtml = '<div class="render-failed" role="note">This section could not be shown.</div>';

const bodyNodeMapping = {
  text: textHtml,
  caution: cautionHtml,
  reading: readingHtml,
  figure: figureHtml,
  image: imageHtml,
  table: tableHtml,
  tableRow: tableRowHtml,
  tableHeader: tableHeaderHtml,
  tableCell: tableCellHtml,
};
const markMapping = { link: linkHtml };

type RenderBody = (context: { content: PMNode }) => string;

/**
 * Builds a string renderer for one node mapping. `renderToHTMLString` resolves the extensions and rebuilds its
 * node and mark mappings on every call (the slow part of a fix page); `renderToElement` hands us the renderer it
 * builds, so we keep that and call it per body.
 */
function buildRenderer(schema: Schema, nodeMapping: typeof bodyNodeMapping): RenderBody {
  let render: RenderBody | null = null;
  renderToElement<string>({
    renderer: (options) => (render = renderJSONContentToString<PMMark, PMNode>(options)),
    domOutputSpecToElement: domOutputSpecToHTMLString,
    mapDefinedTypes: { doc: ({ children }) => serializeChildrenToHTMLString(children), text: textHtml },
    content: schema.topNodeType.createAndFill()!,
    extensions: bodyExtensions(),
    options: { nodeMapping, markMapping },
  });
  if (!render) throw new Error('the static renderer did not build a renderer');
  return render;
}

// Built once per process: the schema, and one renderer for each way a page shows cautions.
let renderers: { schema: Schema; plain: RenderBody; cautionsAbove: RenderBody } | null = null;
function bodyRenderers(): { schema: Schema; plain: RenderBody; cautionsAbove: RenderBody } {
  if (!renderers) {
    const schema = getSchema(bodyExtensions());
    renderers = {
      schema,
      plain: buildRenderer(schema, bodyNodeMapping),
      cautionsAbove: buildRenderer(schema, { ...bodyNodeMapping, caution: cautionPointerHtml }),
    };
  }
  return renderers;
}

function failed(reason: string, options: RenderFixBodyOptions | undefined): FixBodyHtml {
  try {
    options?.onFailure?.(reason);
  } catch {
    // A failing logger must not turn a placeholder into a crashed page.
  }
  return { ok: false, html: renderFailedHtml };
}

export function renderFixBody(json: unknown, options?: RenderFixBodyOptions): FixBodyHtml {
  try {
    const sanitised = sanitiseBody(json);
    if ('error' in sanitised) return failed(sanitised.error, options);
    const { schema, plain, cautionsAbove } = bodyRenderers();
    const doc = schema.nodeFromJSON(sanitised.doc);
    // The sanitiser shapes bodies to the schema; if one still does not fit, show nothing rather than guess.
    doc.check();
    const html = (options?.cautionsShownAbove ? cautionsAbove : plain)({ content: doc });
    return { ok: true, html };
  } catch (error) {
    return failed(error instanceof Error ? error.message : 'the renderer failed', options);
  }
}
