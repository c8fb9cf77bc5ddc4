// The one request-body reader: JSON or a form by content type, each kind under its named cap, never a throw.
import { describe, expect, it } from 'vitest';
import { bodyLimits, readBody, readCappedText, writingInput } from '@/server/http/body';

function post(body: BodyInit | null, type: string | null, headers: Record<string, string> = {}): Request {
  return new Request('http://local/x', {
    method: 'POST',
    body,
    headers: { ...(type ? { 'Content-Type': type } : {}), ...headers },
    // Node's fetch wants this for a stream body.
    ...(body instanceof ReadableStream ? { duplex: 'half' } : {}),
  } as RequestInit);
}

/** A body sent in chunks with no Content-Length, the way a client streams it. */
function streamed(bytes: number, chunk = 16 * 1024): ReadableStream<Uint8Array> {
  let sent = 0;
  return new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= bytes) return controller.close();
      const size = Math.min(chunk, bytes - sent);
      sent += size;
      controller.enqueue(new Uint8Array(size).fill(0x61));
    },
  });
}

describe('readBody', () => {
  it('parses JSON and a URL-encoded form, each by its content type', async () => {
    const asJson = await readBody(post('{"note":"Replaced C12"}', 'application/json; charset=utf-8'), { json: 'tools' });
    expect(asJson).toEqual({ ok: true, value: { kind: 'json', data: { note: 'Replaced C12' } } });
    const asForm = await readBody(post('fix=a-b&note=two+words&note=last', 'application/x-www-form-urlencoded'), { form: 'pageForm' });
    expect(asForm.ok && asForm.value.kind === 'form' && asForm.value.data).toEqual({ fix: 'a-b', note: 'last' });
    expect(asForm.ok && asForm.value.kind === 'form' && asForm.value.form.getAll('note')).toEqual(['two words', 'last']);
  });

  it('refuses a NUL character (PostgreSQL cannot store it) in JSON or a form, with a sentence saying what to do', async () => {
    for (const request of [
      post(JSON.stringify({ values: { title: 'Tray\u0000closes' } }), 'application/json'),
      post(JSON.stringify({ ['key\u0000']: 'x' }), 'application/json'),
      post('note=a%00b', 'application/x-www-form-urlencoded'),
    ]) {
      const read = await readBody(request, { json: 'tools', form: 'pageForm' });
      expect(read.ok).toBe(false);
      expect(!read.ok && read.code).toBe('bad_request');
      expect(!read.ok && read.message).toMatch(/NUL character \(U\+0000\)[\s\S]*e\.g\./);
    }
  });

  it('refuses JSON nested deeper than 100 levels without recursing, and takes 99', async () => {
    const nest = (depth: number) => '['.repeat(depth) + ']'.repeat(depth);
    const deep = await readBody(post(nest(5000), 'application/json'), { json: 'tools' });
    expect(!deep.ok && deep.message).toMatch(/deeper than 100 levels[\s\S]*e\.g\./);
    expect((await readBody(post(nest(99), 'application/json'), { json: 'tools' })).ok).toBe(true);
  });

  it('reads an empty JSON body as an empty object', async () => {
    expect(await readBody(post('', 'application/json'), writingInput)).toEqual({ ok: true, value: { kind: 'json', data: {} } });
  });

  it('refuses a kind the route does not take with 415, naming what to send', async () => {
    const form = await readBody(post('a=1', 'application/x-www-form-urlencoded'), { json: 'tools' });
    expect(form).toMatchObject({ ok: false, code: 'unsupported_media_type' });
    expect(!form.ok && form.message).toContain('application/json');
    const plain = await readBody(post('a', 'text/plain'), writingInput);
    expect(plain).toMatchObject({ ok: false, code: 'unsupported_media_type' });
    expect(await readBody(post('{}', null), { json: 'tools' })).toMatchObject({ ok: false, code: 'unsupported_media_type' });
  });

  it('answers broken JSON with a 400 in a sentence and an example of a good body', async () => {
    const broken = await readBody(post('{"customerRef": ', 'application/json'), { json: 'benchWork' });
    expect(broken).toMatchObject({ ok: false, code: 'bad_request', message: 'The body is not valid JSON.' });
    expect(!broken.ok && broken.fields?._?.[0]).toMatch(/e\.g\. \{"note"/);
  });

  it('refuses text that is not UTF-8', async () => {
    const bad = await readBody(post(new Uint8Array([0x7b, 0xff, 0x7d]), 'application/json'), { json: 'tools' });
    expect(bad).toMatchObject({ ok: false, code: 'bad_request' });
  });

  it('refuses a body over its cap by its declared length', async () => {
    const declared = await readBody(post('{}', 'application/json', { 'Content-Length': String(bodyLimits.tools + 1) }), {
      json: 'tools',
    });
    expect(declared).toMatchObject({ ok: false, code: 'payload_too_large', headers: { Connection: 'close' } });
  });

  it('refuses a streamed body as soon as it passes its cap, whatever it claims', async () => {
    const result = await readBody(post(streamed(bodyLimits.pageForm + 1), 'application/x-www-form-urlencoded'), { form: 'pageForm' });
    expect(result).toMatchObject({ ok: false, code: 'payload_too_large' });
    expect(!result.ok && result.message).toMatch(/larger than 16 kB; send less at a time, e\.g\./);
  });

  it('uses the cap of the kind sent: a draft may be far larger than a decision form', async () => {
    const big = JSON.stringify({ body: 'x'.repeat(bodyLimits.decisionForm * 2) });
    expect((await readBody(post(big, 'application/json'), writingInput)).ok).toBe(true);
    const form = await readBody(post(`note=${'x'.repeat(bodyLimits.decisionForm * 2)}`, 'application/x-www-form-urlencoded'), writingInput);
    expect(form).toMatchObject({ ok: false, code: 'payload_too_large' });
  });

  it('names every cap in one table, each a whole number of kB', () => {
    for (const limit of Object.values(bodyLimits)) expect(limit % 1024).toBe(0);
    expect(bodyLimits.account).toBeLessThan(bodyLimits.benchWork);
  });
});

describe('readCappedText', () => {
  it('drains a moderately oversized body before refusing it, so the client can read the 413', async () => {
    let pulled = 0;
    const limit = 1024;
    const source = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (pulled >= limit * 4) return controller.close();
        pulled += 256;
        controller.enqueue(new Uint8Array(256));
      },
    });
    const result = await readCappedText(post(source, 'application/json'), limit);
    expect(result).toMatchObject({ ok: false, code: 'payload_too_large' });
    expect(pulled).toBe(limit * 4);
  });

  it('drains a body whose declared length is moderately over the cap, and reads none of one declared far over it', async () => {
    const limit = 1024;
    const counted = (bytes: number) => {
      const source = { pulled: 0, stream: undefined as unknown as ReadableStream<Uint8Array> };
      source.stream = new ReadableStream<Uint8Array>({
        pull(controller) {
          if (source.pulled >= bytes) return controller.close();
          source.pulled += 256;
          controller.enqueue(new Uint8Array(256));
        },
      });
      return source;
    };
    const moderate = counted(limit * 4);
    const refused = await readCappedText(post(moderate.stream, 'application/json', { 'Content-Length': String(limit * 4) }), limit);
    expect(refused).toMatchObject({ ok: false, code: 'payload_too_large', headers: { Connection: 'close' } });
    expect(moderate.pulled).toBe(limit * 4);
    const huge = counted(limit * 64);
    const cut = await readCappedText(post(huge.stream, 'application/json', { 'Content-Length': String(limit * 64) }), limit);
    expect(cut).toMatchObject({ ok: false, code: 'payload_too_large' });
    expect(huge.pulled).toBeLessThanOrEqual(256); // at most the one chunk a stream queues before anyone reads
  });

  it('stops draining at eight times the cap and cuts the rest', async () => {
    let pulled = 0;
    const limit = 1024;
    const source = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled += 256;
        controller.enqueue(new Uint8Array(256));
      },
    });
    const result = await readCappedText(post(source, 'application/json'), limit);
    expect(result).toMatchObject({ ok: false, code: 'payload_too_large' });
    expect(pulled).toBeGreaterThan(limit * 8);
    expect(pulled).toBeLessThan(limit * 8 + 256 * 4);
  });
});
