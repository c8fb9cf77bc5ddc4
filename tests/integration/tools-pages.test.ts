// The bench tool pages through the built server without JavaScript: a GET with a query answers the result in the HTML.
import { describe, expect, it } from 'vitest';
import { client } from '../support/http';
import { INTEGRATION_PORT } from '../support/test-env';

const site = client(INTEGRATION_PORT);

/** The page's visible text: scripts and tags (with the islands' serialised props) left out. */
function visibleText(html: string): string {
  return html
    .replace(/<script[\s\S]*?<\/script>/gi, ' ')
    .replace(/<[^>]+>/g, ' ')
    .replace(/&amp;/g, '&')
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/\s+/g, ' ');
}

async function page(
  path: string,
  query: Record<string, string> = {},
): Promise<{ status: number; html: string; text: string; headers: Headers }> {
  const search = new URLSearchParams(query).toString();
  const res = await site.get(search === '' ? path : `${path}?${search}`);
  const html = await res.text();
  return { status: res.status, html, text: visibleText(html), headers: res.headers };
}

function expectNoBrokenFigures(text: string): void {
  expect(text).not.toMatch(/\bNaN\b|\bInfinity\b|\bundefined\b/);
}

describe('the tools index', () => {
  it('lists every tool with what it does and its source', async () => {
    const { status, html, text } = await page('/tools');
    expect(status).toBe(200);
    for (const slug of ['value-decoder', 'preferred-values', 'substitute-check', 'esr', 'life-estimate', 'bleed-down']) {
      expect(html).toContain(`href="/tools/${slug}"`);
    }
    for (const source of [
      'IEC 60062',
      'IEC 60063',
      'IEC 62368-1',
      '10-kelvin rule',
      'tan δ',
      'common practice',
      'from memory, not one named datasheet',
    ])
      expect(text).toContain(source);
    expect(html).toContain('href="/order-list"');
  });
});

describe('tool pages without JavaScript', () => {
  it('bleed-down: the worked example, with the stored-charge caution before the form', async () => {
    const { status, html, text, headers } = await page('/tools/bleed-down', { capacitance: '150uF', resistance: '470k', voltage: '340V' });
    expect(status).toBe(200);
    // RC discharge: t = RC·ln(V0/Vsafe) = 0.00015 × 470000 × ln(340/60) = 122.3 s; V0²/R = 0.246 W (IEC 62368-1 ES1: 60 V DC).
    expect(text).toContain('Time to 60 V 122 s');
    expect(text).toContain('0.246 W');
    // After one time constant 36.8 % is left: 340 V × e^-1 = 125 V.
    expect(text).toContain('1 × RC 70.5 s (1 min 11 s) 125 V');
    const caution = html.indexOf('caution--stored_charge');
    expect(caution).toBeGreaterThan(0);
    expect(caution).toBeLessThan(html.indexOf('action="/tools/bleed-down"'));
    expect(text).toContain('must be measured, not assumed, to be discharged');
    expect(headers.get('cache-control')).toContain('public');
    expectNoBrokenFigures(text);
  });

  it('value decoder: RKM and three-digit codes read as IEC 60062 gives them', async () => {
    // IEC 60062: 4u7 = 4.7 µF; 473 = 47 × 10^3 pF = 47 nF; K = ±10 %.
    expect((await page('/tools/value-decoder', { value: '4u7', kind: 'capacitor', rating: '50V' })).text).toContain(
      'Canonical form: 4.7 µF 50 V',
    );
    expect((await page('/tools/value-decoder', { value: '473K', kind: 'capacitor' })).text).toContain('47 nF ±10 %');
  });

  it('preferred values: 5 kΩ rounds to 4.7 kΩ in E12', async () => {
    // IEC 60063 E12 around 5: 4.7 and 5.6; 5 − 4.7 = 0.3 is the smaller step.
    const { text } = await page('/tools/preferred-values', { value: '5k', quantity: 'resistance', series: 'E12' });
    expect(text).toContain('Nearest E12 value 4.7 kΩ');
    expect(text).toContain('Next above 5.6 kΩ');
  });

  it('substitute check: a lower temperature class fails with its reason', async () => {
    const { text } = await page('/tools/substitute-check', {
      value: '470uF',
      rating: '16V 105C low-ESR',
      candidateValue: '470uF',
      candidateRating: '25V 85C low-ESR',
    });
    expect(text).toContain('The candidate does not fit');
    expect(text).toContain('85 °C class is lower than the original');
  });

  it('ESR: 1000 µF 16 V gives about 0.265 Ω, and 0.4 Ω reads as worn', async () => {
    // tan δ 0.20 at 120 Hz (general-purpose 85 °C table): ESR = 0.20 / (2π × 120 × 0.001) = 0.265 Ω.
    expect((await page('/tools/esr', { capacitance: '1000uF', ratedVoltage: '16V' })).text).toContain('0.265 Ω');
    // 0.4 / 0.265 = 1.51: above the new part's limit but within twice it.
    expect((await page('/tools/esr', { capacitance: '1000uF', ratedVoltage: '16V', measured: '0.4' })).text).toContain('Worn');
  });

  it('life estimate: 2000 h at 105 °C run at 85 °C gives 8000 h, with the figures table', async () => {
    // 10-kelvin rule of makers' application guides: 2000 × 2^((105 − 85) / 10) = 8000 h.
    const { text } = await page('/tools/life-estimate', { ratedLife: '2000', ratedTemperature: '105', ambient: '85' });
    expect(text).toContain('Expected life 8,000 h');
    // The same rule at 65 °C: 2000 × 2^4 = 32 000 h, a row of the table.
    expect(text).toContain('65 °C 32,000 h');
    expectNoBrokenFigures(text);
  });
});

/** The island's module and everything it imports statically, with the text of each module. */
async function staticModuleGraph(html: string): Promise<Map<string, string>> {
  const entries = [...html.matchAll(/component-url="([^"]+)"/g)].map((m) => m[1] as string);
  const seen = new Map<string, string>();
  const queue = [...entries];
  while (queue.length > 0) {
    const path = queue.shift() as string;
    if (seen.has(path)) continue;
    const text = await (await site.get(path)).text();
    seen.set(path, text);
    for (const m of text.matchAll(/(?:from|import)\s*"(\.\/[^"]+\.js)"/g)) queue.push(new URL(m[1] as string, `http://x${path}`).pathname);
  }
  return seen;
}

describe('chart code', () => {
  it('is loaded only by the two chart pages, and there only on demand', async () => {
    for (const slug of ['value-decoder', 'preferred-values', 'substitute-check', 'esr']) {
      const graph = await staticModuleGraph((await page(`/tools/${slug}`)).html);
      expect(graph.size).toBeGreaterThan(0);
      for (const text of graph.values()) expect(text).not.toContain('chart-setup');
    }
    for (const slug of ['bleed-down', 'life-estimate']) {
      const graph = await staticModuleGraph((await page(`/tools/${slug}`)).html);
      expect([...graph.keys()].some((path) => path.includes('chart-setup'))).toBe(false);
      expect([...graph.values()].some((text) => text.includes('chart-setup'))).toBe(true);
    }
  });
});

describe('bad input on the pages', () => {
  it.each([
    [{ capacitance: '47x', resistance: '470k', voltage: '340V' }, 'not a unit or prefix'],
    [{ capacitance: '', resistance: '470k', voltage: '340V' }, 'Nothing to read: the value is empty'],
    [{ capacitance: '1e999', resistance: '470k', voltage: '340V' }, 'too large to be a component value'],
    [{ capacitance: '-150uF', resistance: '470k', voltage: '340V' }, 'is negative'],
    [{ capacitance: '47uF 16k', resistance: '470k', voltage: '340V' }, 'holds more than one value'],
    [{ capacitance: '16V', resistance: '470k', voltage: '340V' }, 'is a voltage, but a capacitance is expected here'],
  ])('bleed-down answers %j with a message and an example', async (query, message) => {
    // A form sends every field, the optional safe voltage too (left empty).
    const { status, text } = await page('/tools/bleed-down', { safeVoltage: '', ...query });
    expect(status).toBe(200);
    expect(text).toContain(message);
    expect(text).toContain('For example: 4.7 µF, 4u7, 100nF or 104');
    expect(text).not.toContain('Time to 60 V');
    expectNoBrokenFigures(text);
  });

  it('the value decoder names the rating when the rating is at fault', async () => {
    const { text } = await page('/tools/value-decoder', { value: '470uF', rating: '16V 47uF', kind: 'capacitor' });
    expect(text).toContain('The rating holds a capacitance');
    expect(text).toContain('For example: 16V 105C low-ESR');
  });

  it('the life estimate works the self-heating out from ripple current, ESR and thermal resistance', async () => {
    // ΔT = I² × ESR × Rth = 1² × 0.1 × 50 = 5 K, so 80 °C + 5 K = 85 °C; 10-kelvin rule: 2000 h × 2² = 8000 h.
    const query = { ratedLife: '2000', ratedTemperature: '105', ambient: '80', rippleCurrent: '1A', esr: '0.1', thermalResistance: '50' };
    const { text } = await page('/tools/life-estimate', query);
    expect(text).toContain('ΔT = I² × ESR × R th');
    expect(text).toContain('Self-heating, I² × ESR × Rth 5 K');
    expect(text).toContain('Part runs at 85 °C');
    expect(text).toContain('Expected life 8,000 h');
    expectNoBrokenFigures(text);
  });

  it('the life estimate refuses a part run above its rating instead of extrapolating', async () => {
    const { text } = await page('/tools/life-estimate', { ratedLife: '2000', ratedTemperature: '85', ambient: '95' });
    expect(text).toContain('above its 85 °C rating');
    expect(text).not.toContain('Expected life');
  });

  it('the ESR tool answers a voltage outside the table with the voltages it has and an example', async () => {
    const { text } = await page('/tools/esr', { capacitance: '1000uF', ratedVoltage: '20V' });
    expect(text).toContain('covers only parts rated 6.3, 10, 16, 25, 35, 50, 63 and 100 V; 20 V is not one of them');
    expect(text).toContain('For example: 16V or 25V');
    expect(text).not.toContain('Largest ESR of a new part');
  });

  it('the ESR page says its tan δ limits are from memory and which rated voltages they cover', async () => {
    const { text } = await page('/tools/esr', {});
    expect(text).toContain('from memory, not one named datasheet');
    expect(text).toContain('The table covers parts rated 6.3, 10, 16, 25, 35, 50, 63 and 100 V only');
  });

  it('a form sent with nothing filled in lists what is needed, with examples', async () => {
    const empty = { value: '', rating: '', candidateValue: '', candidateRating: '', workingVoltage: '', roomDiameter: '', roomHeight: '' };
    const { text } = await page('/tools/substitute-check', empty);
    expect(text).toContain('Check the fields marked above');
    expect(text).toContain('For example:');
    expectNoBrokenFigures(text);
  });
});
