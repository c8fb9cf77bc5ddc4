// Server-rendered textareas show stored text as it was typed: no leading spaces or line breaks from the template.
import { Window } from 'happy-dom';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { DEMO_PASSWORD, signIn } from '../support/sign-in';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let editor: string;

beforeAll(async () => {
  editor = await signIn(base, 'editor@example.test', DEMO_PASSWORD);
});
afterAll(() => knex.destroy());

function textareasOf(html: string): { name: string; value: string }[] {
  const window = new Window({ url: base });
  window.document.write(html);
  return [...window.document.querySelectorAll('textarea')].map((t) => ({ name: t.getAttribute('name') ?? '', value: t.textContent ?? '' }));
}

describe('textareas on the word families page', () => {
  it("shows each family's terms one per line, exactly as stored", async () => {
    const families: { terms: string[] }[] = await knex('word_families').select('terms').orderBy('name');
    expect(families.length).toBeGreaterThan(0);
    const html = await (await fetch(`${base}/admin/word-families`, { headers: { Cookie: editor } })).text();
    const values = textareasOf(html)
      .filter((t) => t.name === 'terms')
      .map((t) => t.value);
    for (const value of values) {
      expect(value).not.toMatch(/^\s/);
      expect(value).not.toMatch(/\n[ \t]+\S/);
    }
    const stored = families.map((f) => f.terms.join('\n'));
    for (const terms of stored) expect(values).toContain(terms);
  });
});
