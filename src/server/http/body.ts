// The one request-body reader: JSON or a URL-encoded form, size-capped (413), typed by content type (415), never a 500.
import { refuse, succeed, type Failure, type Outcome } from './result';

const KiB = 1024;

/**
 * Every body cap, by what is posted. The adapter sets no body limit, so nothing is read past these. Where two readers
 * once capped the same kind of post differently, the smaller cap is kept.
 */
export const bodyLimits = {
  /** Account, sign-in and admin forms and the account JSON: a few short fields. */
  account: 32 * KiB,
  /** The fix page's small plain forms (adding a part to the order list). */
  pageForm: 16 * KiB,
  /** Writing and proofing forms: a decision with its note, a report, a withdrawal. */
  decisionForm: 64 * KiB,
  /** Bench work: bench reports, hand-over notes, job sheets with their parts lines, as JSON or a form. */
  benchWork: 256 * KiB,
  /** The bench tools' API: an order list of 2000 rows fits with room to spare. */
  tools: 256 * KiB,
  /** A draft with a long remedy and its tables stays well under this. */
  draft: 2 * 1024 * KiB,
} as const;
export type BodyLimit = keyof typeof bodyLimits;

/** How far past its limit a body is read and thrown away before the connection is cut. */
const DRAIN_FACTOR = 8;

/** A body as read: parsed JSON, or a form's fields (the last value of a repeated name wins in `data`). */
export type Body = { kind: 'json'; data: unknown } | { kind: 'form'; data: Record<string, string>; form: URLSearchParams };

/** The kinds a route accepts, each with its cap. */
export interface Accept {
  json?: BodyLimit;
  form?: BodyLimit;
}

function kib(limit: number): string {
  return limit >= 1024 * KiB ? `${limit / (1024 * KiB)} MB` : `${Math.floor(limit / KiB)} kB`;
}

/** The unread rest of the body may still be arriving: close the connection rather than let a client reuse it. */
function tooLarge(limit: number): Failure {
  return {
    ...refuse(
      'payload_too_large',
      `The body is larger than ${kib(limit)}; send less at a time, e.g. a long list in two parts or a long fix as two fixes.`,
    ),
    headers: { Connection: 'close' },
  };
}

async function drain(reader: ReadableStreamDefaultReader<Uint8Array>, read: number, most: number): Promise<void> {
  let size = read;
  try {
    while (size <= most) {
      const { done, value } = await reader.read();
      if (done) return;
      size += value.byteLength;
    }
  } catch {
    return;
  }
  await reader.cancel().catch(() => undefined);
}

/** Reads the body as UTF-8 text, refusing it as soon as it passes the limit, whatever Content-Length claims. */
export async function readCappedText(request: Request, limit: number): Promise<Outcome<string>> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (Number.isFinite(declared) && declared > limit) {
    // Refused by its declared length; still read and thrown away when moderately oversized, as below: answering
    // while the client is still sending can reset the connection before it reads the 413.
    if (request.body && declared <= limit * DRAIN_FACTOR) await drain(request.body.getReader(), 0, limit * DRAIN_FACTOR);
    return tooLarge(limit);
  }
  if (!request.body) return succeed('');
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      // Drain a moderately oversized body so the client reads the 413 instead of a reset mid-upload;
      // past DRAIN_FACTOR times the limit the connection is cut.
      await drain(reader, size, limit * DRAIN_FACTOR);
      return tooLarge(limit);
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(size);
  let at = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, at);
    at += chunk.byteLength;
  }
  try {
    return succeed(new TextDecoder('utf-8', { fatal: true }).decode(bytes));
  } catch {
    return refuse('bad_request', 'The body is not valid UTF-8 text; save it as UTF-8, e.g. from a text editor’s “Save as UTF-8”.');
  }
}

function unsupported(accept: Accept) {
  const message =
    accept.json && accept.form
      ? 'Send JSON (Content-Type: application/json) or a plain form (application/x-www-form-urlencoded).'
      : accept.json
        ? 'Send the body as JSON with Content-Type: application/json.'
        : 'Send the form as application/x-www-form-urlencoded, e.g. from this site’s own page.';
  return refuse('unsupported_media_type', message);
}

/** Deeper than any fix body the editor makes (lists in lists stay well under it); PostgreSQL refuses much deeper JSON. */
const MAX_JSON_DEPTH = 100;

/**
 * Text PostgreSQL cannot store (the NUL character) or JSON nested past MAX_JSON_DEPTH, found without recursion: such a
 * body is refused whole rather than failing later in the database.
 */
function unstorable(data: unknown): Failure | null {
  const stack: [unknown, number][] = [[data, 0]];
  while (stack.length > 0) {
    const [value, depth] = stack.pop()!;
    if (typeof value === 'string') {
      if (value.includes('\u0000')) return nulRefusal();
    } else if (value !== null && typeof value === 'object') {
      if (depth >= MAX_JSON_DEPTH)
        return refuse(
          'bad_request',
          `The body nests deeper than ${MAX_JSON_DEPTH} levels; send flatter data, e.g. {"parts": [{"ref": "C12"}]}.`,
        );
      for (const [key, child] of Object.entries(value)) {
        if (key.includes('\u0000')) return nulRefusal();
        stack.push([child, depth + 1]);
      }
    }
  }
  return null;
}

function nulRefusal(): Failure {
  return refuse(
    'bad_request',
    'The text holds a NUL character (U+0000), which cannot be stored; remove it, e.g. paste the text again as plain text.',
  );
}

/**
 * Reads a JSON body or a URL-encoded form, as the route accepts, each kind with its named cap. An empty JSON body
 * reads as `{}` (a button that posts no fields); JSON with a syntax error is a 400 that says where to look.
 */
export async function readBody(request: Request, accept: Accept): Promise<Outcome<Body>> {
  const type = (request.headers.get('content-type') ?? '').trim();
  const isJson = /^application\/json\b/i.test(type);
  const isForm = /^application\/x-www-form-urlencoded\b/i.test(type);
  const limit = isJson ? accept.json : isForm ? accept.form : undefined;
  if (limit === undefined) return unsupported(accept);
  const text = await readCappedText(request, bodyLimits[limit]);
  if (!text.ok) return text;
  if (isForm) {
    const form = new URLSearchParams(text.value);
    const data = Object.fromEntries(form);
    return unstorable([...form]) ?? succeed({ kind: 'form', form, data });
  }
  if (text.value.trim() === '') return succeed({ kind: 'json', data: {} });
  let data: unknown;
  try {
    data = JSON.parse(text.value) as unknown;
  } catch (error) {
    const where = error instanceof SyntaxError ? `${error.message}. ` : '';
    return refuse('bad_request', 'The body is not valid JSON.', {
      _: [`${where}Send one JSON object, e.g. {"note": "Replaced C12", "quantity": 2}.`],
    });
  }
  return unstorable(data) ?? succeed({ kind: 'json', data });
}

/** The writing and proofing endpoints: a draft as JSON from the editor, or a small plain form from a page. */
export const writingInput: Accept = { json: 'draft', form: 'decisionForm' };
