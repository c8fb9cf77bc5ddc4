// The one result and the one function that turns it into a response, in the one error shape.
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { apiError, statusOf } from '@/server/http/responses';
import { inputRefusal, refuse, respond, schemaRefusal, succeed } from '@/server/http/result';

describe('respond', () => {
  it('answers a value as private JSON, 200 unless told', async () => {
    const ok = respond(succeed({ saved: true }));
    expect(ok.status).toBe(200);
    expect(ok.headers.get('Content-Type')).toBe('application/json; charset=utf-8');
    expect(ok.headers.get('Cache-Control')).toBe('private, no-store');
    expect(await ok.json()).toEqual({ saved: true });
    expect(respond(succeed({ id: 3 }), { status: 201 }).status).toBe(201);
    expect(await respond(succeed(undefined)).json()).toEqual({ ok: true });
  });

  it('answers a refusal in the one shape with the status of its code', async () => {
    const fields = { 'parts.0.quantity': ['Give a whole number of parts, e.g. 2.'] };
    const refused = respond(refuse('bad_request', 'Some fields are not valid; e.g. quantity 2.', fields));
    expect(refused.status).toBe(400);
    expect(refused.headers.get('Cache-Control')).toBe('private, no-store');
    expect(await refused.json()).toEqual({
      error: { code: 'bad_request', message: 'Some fields are not valid; e.g. quantity 2.', fields },
    });
  });

  it('leaves fields out when there are none, exactly as apiError does', async () => {
    const a = await respond(refuse('not_found', 'No fix has that address, e.g. /fixes/tl2-tray.')).json();
    const b = await apiError('not_found', 'No fix has that address, e.g. /fixes/tl2-tray.').json();
    expect(a).toEqual(b);
    expect(Object.keys(a.error)).toEqual(['code', 'message']);
  });

  it('puts a 409’s detail beside error, not inside it', async () => {
    const conflict = respond(refuse('conflict', 'Someone saved first.', undefined, { mine: { n: 1 }, theirs: { n: 2 } }));
    expect(conflict.status).toBe(409);
    expect(await conflict.json()).toEqual({
      error: { code: 'conflict', message: 'Someone saved first.' },
      mine: { n: 1 },
      theirs: { n: 2 },
    });
  });

  it('sends Retry-After for a rate limit and the headers a refusal carries', () => {
    const limited = respond(refuse('too_many_requests', 'Wait 2 minutes.', undefined, undefined, 90));
    expect(limited.status).toBe(429);
    expect(limited.headers.get('Retry-After')).toBe('90');
    const large = respond({ ...refuse('payload_too_large', 'Send less, e.g. half the list.'), headers: { Connection: 'close' } });
    expect(large.status).toBe(413);
    expect(large.headers.get('Connection')).toBe('close');
    expect(respond(refuse('payload_too_large', 'Send less, e.g. one photo at a time.')).headers.get('Connection')).toBeNull();
  });

  it('has a status for every error code', () => {
    for (const [code, status] of Object.entries(statusOf)) expect(respond(refuse(code as keyof typeof statusOf, 'x')).status).toBe(status);
  });
});

describe('refusals of the bench tools', () => {
  it('puts the example into the field’s message', () => {
    const refused = inputRefusal('value', { message: 'That is not a capacitance.', example: '4.7 µF, 4u7 or 104' });
    expect(refused).toEqual({
      ok: false,
      code: 'bad_request',
      message: 'That is not a capacitance. For example: 4.7 µF, 4u7 or 104',
      fields: { value: ['That is not a capacitance. For example: 4.7 µF, 4u7 or 104'] },
    });
  });

  it('names the first field at fault and gives a whole good body', () => {
    const parsed = z.object({ value: z.string() }).safeParse({ value: 3 });
    expect(parsed.success).toBe(false);
    const refused = schemaRefusal(parsed.error!, '{ "value": "470uF" }');
    expect(refused.message).toMatch(/^value: .+ For example: \{ "value": "470uF" \}$/);
    expect(Object.keys(refused.fields ?? {})).toEqual(['value']);
  });
});
