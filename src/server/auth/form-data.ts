// Reads a submitted form into plain strings for a zod schema, with a size cap (the adapter sets no body limit).

/** Account forms are a few short fields; anything larger is not one of ours. */
export const MAX_FORM_BYTES = 32 * 1024;

export type FormRead = { ok: true; fields: Record<string, string> } | { ok: false; reason: 'too_large' | 'not_a_form' };

export async function readCapped(body: ReadableStream<Uint8Array>, cap: number): Promise<string | null> {
  const reader = body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > cap) {
      await reader.cancel();
      return null;
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString('utf8');
}

/** URL-encoded forms only: ours never upload files. */
export async function readForm(request: Request): Promise<FormRead> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('application/x-www-form-urlencoded')) return { ok: false, reason: 'not_a_form' };
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > MAX_FORM_BYTES) return { ok: false, reason: 'too_large' };
  if (!request.body) return { ok: true, fields: {} };
  const raw = await readCapped(request.body, MAX_FORM_BYTES);
  if (raw === null) return { ok: false, reason: 'too_large' };
  const fields: Record<string, string> = {};
  for (const [key, value] of new URLSearchParams(raw)) fields[key] = value;
  return { ok: true, fields };
}

export type JsonRead = { ok: true; body: unknown } | { ok: false; reason: 'too_large' | 'not_json' };

/** A small JSON body, parsed; never throws on bad input. */
export async function readJson(request: Request): Promise<JsonRead> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('application/json')) return { ok: false, reason: 'not_json' };
  if (Number(request.headers.get('content-length') ?? '0') > MAX_FORM_BYTES) return { ok: false, reason: 'too_large' };
  const raw = request.body ? await readCapped(request.body, MAX_FORM_BYTES) : '';
  if (raw === null) return { ok: false, reason: 'too_large' };
  try {
    return { ok: true, body: JSON.parse(raw) };
  } catch {
    return { ok: false, reason: 'not_json' };
  }
}
