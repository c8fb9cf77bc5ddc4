// Request bodies for the tools' API and forms: size-capped (413), typed by content type (415), never a 500.
import { apiError } from '@/server/http/responses';

/** Largest body any tool endpoint reads: an order list of 2000 rows fits with room to spare. */
export const MAX_BODY_BYTES = 256 * 1024;

export type BodyRead<T> = { ok: true; value: T } | { ok: false; response: Response };

/** The unread rest of the body may still be arriving: close the connection rather than let a client reuse it. */
function tooLarge(limit: number): BodyRead<never> {
  const response = apiError('payload_too_large', `The body is larger than ${Math.floor(limit / 1024)} kB; send fewer lines at a time.`);
  response.headers.set('Connection', 'close');
  return { ok: false, response };
}

/** How far past its limit a body is read and thrown away before the connection is cut. */
const DRAIN_FACTOR = 8;

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

/** Reads the body as text, refusing it as soon as it passes the limit, whatever Content-Length claims. */
export async function readCappedText(request: Request, limit = MAX_BODY_BYTES): Promise<BodyRead<string>> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (Number.isFinite(declared) && declared > limit) return tooLarge(limit);
  if (!request.body) return { ok: true, value: '' };
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      // Drain a moderately oversized body so the client reads the 413 instead of a reset mid-upload;
      // past DRAIN_BYTES the connection is cut.
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
    return { ok: true, value: new TextDecoder('utf-8', { fatal: true }).decode(bytes) };
  } catch {
    return { ok: false, response: apiError('bad_request', 'The body is not valid UTF-8 text.') };
  }
}

/** A JSON body: application/json only, capped, parsed; a syntax error is a 400 that says where to look. */
export async function readJsonBody(request: Request): Promise<BodyRead<unknown>> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^application\/json\b/i.test(type.trim())) {
    return { ok: false, response: apiError('unsupported_media_type', 'Send the body as JSON with Content-Type: application/json.') };
  }
  const text = await readCappedText(request);
  if (!text.ok) return text;
  try {
    return { ok: true, value: JSON.parse(text.value) as unknown };
  } catch (error) {
    const detail = error instanceof SyntaxError ? ` (${error.message})` : '';
    return {
      ok: false,
      response: apiError('bad_request', `The body is not valid JSON${detail}.`, {
        _: ['Send one JSON object, e.g. {"value": "470uF", "rating": "16V"}.'],
      }),
    };
  }
}

/** A URL-encoded form body (the fix page's plain HTML forms), capped like the JSON bodies. */
export async function readFormBody(request: Request, limit = 16 * 1024): Promise<BodyRead<URLSearchParams>> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^application\/x-www-form-urlencoded\b/i.test(type.trim())) {
    return { ok: false, response: apiError('unsupported_media_type', 'Send the form as application/x-www-form-urlencoded.') };
  }
  const text = await readCappedText(request, limit);
  return text.ok ? { ok: true, value: new URLSearchParams(text.value) } : text;
}
