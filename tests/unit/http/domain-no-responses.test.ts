// Domain code does not speak HTTP: only src/server/http (and pages, endpoints, Actions) build Response objects.
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const server = resolve(__dirname, '../../../src/server');
const lib = resolve(__dirname, '../../../src/lib');

function sources(dir: string, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) sources(path, out);
    else if (/\.tsx?$/.test(name)) out.push(path);
  }
  return out;
}

/** Building a response, or taking a response builder from http/. Reading a fetched Response is fine. */
const speaksHttp =
  /new Response\(|Response\.(json|redirect)\(|import\s*\{[^}]*\b(apiError|json|seeOther|respond|answer|runForm)\b[^}]*\}\s*from\s*'[^']*http\//;

describe('domain modules', () => {
  it('build no Response outside src/server/http', () => {
    const offenders = sources(server)
      .filter((file) => !relative(server, file).startsWith('http'))
      .filter((file) => speaksHttp.test(readFileSync(file, 'utf8')))
      .map((file) => relative(server, file));
    expect(offenders).toEqual([]);
  });

  it('and src/lib builds none either', () => {
    const offenders = sources(lib)
      .filter((file) => /new Response\(/.test(readFileSync(file, 'utf8')))
      .map((file) => relative(lib, file));
    expect(offenders).toEqual([]);
  });

  it('would catch one that did', () => {
    expect(speaksHttp.test("import { apiError } from '../http/responses';")).toBe(true);
    expect(speaksHttp.test('return new Response(null, { status: 303 });')).toBe(true);
    expect(speaksHttp.test("import { statusOf } from '../http/responses';")).toBe(false);
  });
});
