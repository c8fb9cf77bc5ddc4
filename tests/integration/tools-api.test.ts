// The bench tools' API through the built server: good input, bad input with the field and an example, 413, 415, CSV.
import { describe, expect, it } from 'vitest';
import { client } from '../support/http';
import { INTEGRATION_PORT } from '../support/test-env';

const api = client(INTEGRATION_PORT);

async function getJson(path: string): Promise<{ status: number; body: any; headers: Headers }> {
  const res = await api.get(path);
  return { status: res.status, body: await res.json(), headers: res.headers };
}

async function postJson(
  path: string,
  body: unknown,
  headers: Record<string, string> = {},
): Promise<{ status: number; body: any; headers: Headers }> {
  const res = await fetch(`${api.base}${path}`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', ...headers },
    body: typeof body === 'string' ? body : JSON.stringify(body),
  });
  const text = await res.text();
  return { status: res.status, body: res.headers.get('content-type')?.includes('json') ? JSON.parse(text) : text, headers: res.headers };
}

const decode = (query: Record<string, string>) => getJson(`/api/v1/tools/decode?${new URLSearchParams(query).toString()}`);

/** Every answer: no NaN, Infinity or "undefined" anywhere in it. */
function expectClean(body: unknown): void {
  expect(JSON.stringify(body)).not.toMatch(/NaN|Infinity|undefined/);
}

describe('GET /api/v1/tools/decode', () => {
  it('reads a capacitor row into its canonical spec', async () => {
    const { status, body, headers } = await decode({ value: '470uF', rating: '16V 105C low-ESR', kind: 'capacitor' });
    expect(status).toBe(200);
    // SI prefix µ = 10^-6: 470 µF is 0.00047 F.
    expect(body.canonical).toBe('470 µF 16 V 105 °C low-ESR');
    expect(body.spec).toEqual(
      expect.objectContaining({ quantity: 'capacitance', magnitude: 0.00047, voltage: 16, temperatureC: 105, lowEsr: true }),
    );
    expect(headers.get('cache-control')).toContain('public');
  });

  it('reads marking codes as IEC 60062 gives them', async () => {
    // IEC 60062 RKM code: 4u7 = 4.7 µF, 2k2 = 2.2 kΩ; three-digit code 104 = 10 × 10^4 pF = 100 nF.
    expect((await decode({ value: '4u7', kind: 'capacitor' })).body.canonical).toBe('4.7 µF');
    expect((await decode({ value: '2k2', kind: 'resistor' })).body.canonical).toBe('2.2 kΩ');
    expect((await decode({ value: '104', kind: 'capacitor' })).body.canonical).toBe('100 nF');
  });

  it.each([
    ['47x', 'value', /not a unit or prefix/],
    ['', 'value', /empty/],
    ['1e999', 'value', /too large/],
    ['-47uF', 'value', /negative/],
    ['47uF 16k', 'value', /more than one value/],
    ['16V', 'value', /is a voltage, but a capacitance is expected/],
  ])('answers 400 for the capacitor value "%s" with the field and an example', async (value, field, pattern) => {
    const { status, body } = await decode({ value, kind: 'capacitor' });
    expect(status).toBe(400);
    expect(body.error.code).toBe('bad_request');
    expect(body.error.message).toMatch(pattern);
    expect(body.error.fields[field][0]).toMatch(/For example: 4\.7 µF, 4u7, 100nF or 104/);
    expectClean(body);
  });

  it('names the rating when the value is fine and the rating is not', async () => {
    const { status, body } = await decode({ value: '470uF', rating: '16V 2k2', kind: 'capacitor' });
    expect(status).toBe(400);
    expect(Object.keys(body.error.fields)).toEqual(['rating']);
    expect(body.error.fields.rating[0]).toContain('For example:');
  });

  it('answers 400 with the kinds it knows for an unknown kind', async () => {
    const { status, body } = await decode({ value: '470uF', kind: 'toaster' });
    expect(status).toBe(400);
    expect(body.error.fields.kind[0]).toContain('capacitor');
  });
});

describe('POST /api/v1/tools/decode', () => {
  it('takes the same fields as a JSON body and is never cached', async () => {
    const { status, body, headers } = await postJson('/api/v1/tools/decode', { value: '4R7', rating: '0.25W 1%', kind: 'resistor' });
    expect(status).toBe(200);
    // IEC 60062: R as the decimal point, 4R7 = 4.7 Ω.
    expect(body.canonical).toBe('4.7 Ω ±1 % 0.25 W');
    expect(headers.get('cache-control')).toContain('no-store');
  });

  it('answers 415 for a body that is not JSON', async () => {
    const res = await fetch(`${api.base}/api/v1/tools/decode`, {
      method: 'POST',
      headers: { 'Content-Type': 'text/csv' },
      body: 'value\n470uF',
    });
    expect(res.status).toBe(415);
    expect((await res.json()).error.code).toBe('unsupported_media_type');
  });

  it('answers 400, not 500, for broken JSON and for JSON that is not an object', async () => {
    const broken = await postJson('/api/v1/tools/decode', '{"value": "470uF"');
    expect(broken.status).toBe(400);
    expect(broken.body.error.message).toContain('not valid JSON');
    const list = await postJson('/api/v1/tools/decode', ['470uF']);
    expect(list.status).toBe(400);
    expect(list.body.error.message).toContain('For example:');
  });

  it('answers 413 for a body over 256 kB, with or without a Content-Length', async () => {
    const big = JSON.stringify({ value: '470uF', padding: 'x'.repeat(300 * 1024) });
    const declared = await postJson('/api/v1/tools/decode', big);
    expect(declared.status).toBe(413);
    expect(declared.body.error.code).toBe('payload_too_large');
    const chunks = new TextEncoder().encode(big);
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let at = 0; at < chunks.length; at += 16 * 1024) controller.enqueue(chunks.slice(at, at + 16 * 1024));
        controller.close();
      },
    });
    const res = await fetch(`${api.base}/api/v1/tools/decode`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: stream,
      duplex: 'half',
    } as RequestInit);
    expect(res.status).toBe(413);
  });
});

describe('POST /api/v1/tools/substitute', () => {
  const original = { capacitanceF: 0.00047, ratedVoltageV: 16, temperatureC: 85 };

  it('passes a higher-rated part and gives each check its reason', async () => {
    const { status, body } = await postJson('/api/v1/tools/substitute', {
      original,
      candidate: { capacitanceF: 0.00047, ratedVoltageV: 25, temperatureC: 105 },
      workingVoltageV: 12,
    });
    expect(status).toBe(200);
    expect(body.verdict).toBe('pass');
    // Common practice: at least 1.25 × 12 V = 15 V; 25 V passes.
    expect(body.checks.find((c: any) => c.check === 'headroom')).toEqual(
      expect.objectContaining({ status: 'pass', reason: expect.stringContaining('15 V') }),
    );
    expectClean(body);
  });

  it('fails a part with a lower voltage and a lower temperature class', async () => {
    const { body } = await postJson('/api/v1/tools/substitute', {
      original,
      candidate: { capacitanceF: 0.00047, ratedVoltageV: 10, temperatureC: 85 },
    });
    expect(body.verdict).toBe('fail');
    expect(body.checks.find((c: any) => c.check === 'ratedVoltage').status).toBe('fail');
  });

  it('answers 400 naming each bad field, with an example body', async () => {
    const { status, body } = await postJson('/api/v1/tools/substitute', {
      original: { ...original, capacitanceF: '47x' },
      candidate: { capacitanceF: 0.00047, ratedVoltageV: -25 },
    });
    expect(status).toBe(400);
    expect(Object.keys(body.error.fields)).toEqual(expect.arrayContaining(['original.capacitanceF', 'candidate.ratedVoltageV']));
    expect(body.error.message).toContain('For example:');
    expect(body.error.message).toContain('capacitanceF');
  });

  it('answers 400 for an infinite capacitance (1e999 reads as Infinity in JSON)', async () => {
    const { status, body } = await postJson(
      '/api/v1/tools/substitute',
      `{"original":{"capacitanceF":1e999,"ratedVoltageV":16},"candidate":{"capacitanceF":0.00047,"ratedVoltageV":16}}`,
    );
    expect(status).toBe(400);
    expect(body.error.fields['original.capacitanceF'][0]).toMatch(/number/);
  });
});

describe('POST /api/v1/tools/order-list', () => {
  const lines = [
    { source: 'Tray will not close', ref: 'C512', kind: 'capacitor', value: '470uF', rating: '16V 105C', quantity: 1 },
    { source: 'Slow to start', ref: 'C1411', kind: 'capacitor', value: '470 µF', rating: '16 V 105 °C', quantity: 1 },
    { source: '=HYPERLINK("http://example.test")', ref: 'R803', kind: 'resistor', value: '470k', rating: '0.5W', quantity: 1 },
  ];

  it('groups rows that are the same part written two ways, with spares rounded up', async () => {
    const { status, body } = await postJson('/api/v1/tools/order-list', { lines, spares: { percent: 10 } });
    expect(status).toBe(200);
    const capacitor = body.lines.find((l: any) => l.label === '470 µF 16 V 105 °C');
    expect(capacitor).toEqual(expect.objectContaining({ quantity: 2, spares: 1, total: 3, refs: ['C512', 'C1411'] }));
    expect(body.lines).toHaveLength(2);
  });

  it('answers the CSV with its headers when asked for format=csv', async () => {
    const res = await fetch(`${api.base}/api/v1/tools/order-list?format=csv`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ lines }),
    });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(res.headers.get('content-disposition')).toBe('attachment; filename="order-list.csv"');
    const text = (await res.text()).replace(/^\uFEFF/, '');
    expect(text.split('\n')[0]).toBe('kind,part,quantity,spares,to order,refs,sources,notes,flag');
    expect(text).toContain('470 µF 16 V 105 °C');
    // A cell that would run as a spreadsheet formula is defused with an apostrophe.
    expect(text).toContain(`"'=HYPERLINK(""http://example.test"")"`);
  });

  it('answers 400 for bad rows and for an unknown format', async () => {
    const bad = await postJson('/api/v1/tools/order-list', { lines: [{ ...lines[0], quantity: 0 }] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['lines.0.quantity']);
    const format = await postJson('/api/v1/tools/order-list?format=xls', { lines });
    expect(format.status).toBe(400);
    expect(format.body.error.fields.format).toBeDefined();
  });

  it('answers 413 for an order list over 256 kB', async () => {
    const many = Array.from({ length: 3000 }, (_, i) => ({ ...lines[0], ref: `C${i}`, notes: 'n'.repeat(80) }));
    const { status } = await postJson('/api/v1/tools/order-list', { lines: many });
    expect(status).toBe(413);
  });
});

describe('/api/v1/order-list', () => {
  it('answers 401 in the error shape when signed out', async () => {
    const { status, body } = await getJson('/api/v1/order-list');
    expect(status).toBe(401);
    expect(body.error.code).toBe('unauthorised');
  });
});
