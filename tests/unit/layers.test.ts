// The layers stay apart: lib is pure, server never reaches into islands or pages, components and islands
// never reach querying server code. Read from the import graph of the source tree, so a new import that
// crosses a line fails here before review.
import { existsSync, readFileSync, readdirSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = resolve(__dirname, '../..');
const src = join(root, 'src');

interface Edge {
  from: string;
  to: string;
  spec: string;
  typeOnly: boolean;
}

function walk(dir: string, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) walk(path, out);
    else if (/\.(ts|tsx|astro|mjs|js)$/.test(name)) out.push(path);
  }
  return out;
}

function resolveSpec(importer: string, spec: string): string | null {
  let base: string;
  if (spec.startsWith('@/')) base = join(src, spec.slice(2));
  else if (spec.startsWith('.')) base = resolve(dirname(importer), spec);
  else return null;
  for (const candidate of [base, `${base}.ts`, `${base}.tsx`, `${base}.astro`, join(base, 'index.ts')]) {
    if (existsSync(candidate) && statSync(candidate).isFile()) return candidate;
  }
  return null;
}

const importPattern = /(?:^|\n)\s*(import|export)\s+(type\s+)?(?:[^'";]*?\sfrom\s+)?['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g;

function edgesOf(file: string): { edges: Edge[]; bare: string[] } {
  const text = readFileSync(file, 'utf8');
  const edges: Edge[] = [];
  const bare: string[] = [];
  for (const m of text.matchAll(importPattern)) {
    const spec = m[3] ?? m[4];
    if (!spec) continue;
    const to = resolveSpec(file, spec);
    if (to) edges.push({ from: file, to, spec, typeOnly: Boolean(m[2]) });
    else if (!spec.startsWith('.') && !spec.startsWith('@/')) bare.push(spec);
  }
  return { edges, bare };
}

const files = walk(src);
const graph = new Map(files.map((f) => [f, edgesOf(f)]));
const rel = (p: string) => relative(root, p).split(sep).join('/');
const under = (p: string, folder: string) => rel(p).startsWith(`src/${folder}/`);

/** Server modules that reach the database, directly or through other modules. */
function queryingModules(): Set<string> {
  const querying = new Set<string>();
  const seeds = files.filter((f) => under(f, 'server') && graph.get(f)!.bare.some((b) => b === 'knex' || b === 'pg'));
  for (const f of files) if (/src\/server\/(core\/)?db\.ts$/.test(rel(f))) seeds.push(f);
  seeds.forEach((s) => querying.add(s));
  let grew = true;
  while (grew) {
    grew = false;
    for (const [file, { edges }] of graph) {
      if (querying.has(file) || !under(file, 'server')) continue;
      if (edges.some((e) => !e.typeOnly && querying.has(e.to))) {
        querying.add(file);
        grew = true;
      }
    }
  }
  return querying;
}

function crossings(filter: (e: Edge) => boolean): string[] {
  return [...graph.values()].flatMap(({ edges }) => edges.filter(filter).map((e) => `${rel(e.from)} imports ${e.spec}`));
}

/** Packages and Node modules that do I/O; pure code takes values and returns values. */
const ioPackages =
  /^(node:)?(fs|fs\/promises|net|http|https|child_process|dgram|tls|dns|worker_threads)$|^(knex|pg|pg-boss|sharp|nodemailer|@aws-sdk\/.*|astro:.*)$/;

describe('the layers of src', () => {
  it('keeps src/lib pure: no server code and no I/O', () => {
    const server = crossings((e) => under(e.from, 'lib') && under(e.to, 'server'));
    const io = files
      .filter((f) => under(f, 'lib'))
      .flatMap((f) =>
        graph
          .get(f)!
          .bare.filter((b) => ioPackages.test(b))
          .map((b) => `${rel(f)} imports ${b}`),
      );
    expect([...server, ...io]).toEqual([]);
  });

  it('keeps src/server out of islands and pages', () => {
    expect(crossings((e) => under(e.from, 'server') && (under(e.to, 'islands') || under(e.to, 'pages')))).toEqual([]);
  });

  it('keeps islands away from server code (type-only imports are erased and allowed)', () => {
    expect(crossings((e) => under(e.from, 'islands') && under(e.to, 'server') && !e.typeOnly)).toEqual([]);
  });

  it('lets components take data as props: none imports a server module that queries', () => {
    const querying = queryingModules();
    expect(crossings((e) => under(e.from, 'components') && !e.typeOnly && querying.has(e.to))).toEqual([]);
  });

  it('finds the import graph it checks (a broken pattern would make every rule pass)', () => {
    const edges = [...graph.values()].reduce((n, g) => n + g.edges.length, 0);
    expect(files.length).toBeGreaterThan(300);
    expect(edges).toBeGreaterThan(1000);
    expect(queryingModules().size).toBeGreaterThan(20);
  });
});
