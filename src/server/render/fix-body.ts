// renderFixBody: the one way a stored fix body becomes HTML. Sanitises, renders without a DOM, never throws.
import { getSchema, type Extensions } from '@tiptap/core';
import type { Schema } from '@tiptap/pm/model';
import { renderToHTMLString } from '@tiptap/static-renderer/pm/html-string';
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

const nodeMapping = {
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

// Built once per process: resolving extensions and building the schema is the slow part.
let renderer: { extensions: Extensions; schema: Schema } | null = null;
function bodyRenderer(): { extensions: Extensions; schema: Schema } {
  if (!renderer) {
    const extensions = bodyExtensions();
    renderer = { extensions, schema: getSchema(extensions) };
  }
  return renderer;
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
    const { extensions, schema } = bodyRenderer();
    const doc = schema.nodeFromJSON(sanitised.doc);
    // The sanitiser shapes bodies to the schema; if one still does not fit, show nothing rather than guess.
    doc.check();
    const mapping = options?.cautionsShownAbove ? { ...nodeMapping, caution: cautionPointerHtml } : nodeMapping;
    const html = renderToHTMLString({ content: doc, extensions, options: { nodeMapping: mapping, markMapping } });
    return { ok: true, html };
  } catch (error) {
    return failed(error instanceof Error ? error.message : 'the renderer failed', options);
  }
}
