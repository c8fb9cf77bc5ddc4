// A small local fake of the Meilisearch HTTP API: indexes, settings, documents, tasks, and search with filters.
/*
  What it does: keeps indexes in memory, applies every task at once (status "succeeded"), parses filter
  expressions (=, !=, IN [...], AND, OR, NOT, parentheses, arrays of conditions) with Meilisearch's
  quoting and escapes, counts facets, and marks matched words. Its matching is simple on purpose: a
  document matches when it contains the query's words (or their synonyms), dropping words from the
  end until something matches (unless matchingStrategy is "all"); a quoted phrase counts as its words. Use it to check our requests, settings and result mapping, never
  ranking quality. It can be stopped and started again on the same port to play an outage.
*/
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';

type Doc = Record<string, unknown> & { id: number | string };
interface FakeIndex {
  primaryKey: string | null;
  settings: Record<string, unknown>;
  docs: Map<string, Doc>;
}
interface FakeTask {
  uid: number;
  indexUid: string | null;
  status: 'succeeded' | 'failed';
  type: string;
  error: { code: string; message: string; type: string; link: string } | null;
  enqueuedAt: string;
}
export interface RecordedRequest {
  method: string;
  path: string;
  body: unknown;
}

class FilterError extends Error {}

/** Splits a filter into tokens: quoted strings (with \" and \\ escapes), brackets, operators, words. */
function tokenize(filter: string): string[] {
  const tokens: string[] = [];
  let i = 0;
  while (i < filter.length) {
    const c = filter[i]!;
    if (/\s/.test(c)) i++;
    else if (c === '"' || c === "'") {
      let value = '';
      i++;
      while (i < filter.length && filter[i] !== c) {
        if (filter[i] === '\\' && i + 1 < filter.length) i++;
        value += filter[i];
        i++;
      }
      if (filter[i] !== c) throw new FilterError(`unterminated string in: ${filter}`);
      tokens.push(`\u0000${value}`);
      i++;
    } else if ('()[],='.includes(c)) {
      tokens.push(c);
      i++;
    } else if (filter.startsWith('!=', i)) {
      tokens.push('!=');
      i += 2;
    } else {
      const word = /^[^\s()[\],=!"']+/.exec(filter.slice(i))?.[0] ?? '';
      if (!word) throw new FilterError(`unexpected character ${c}`);
      tokens.push(word);
      i += word.length;
    }
  }
  return tokens;
}

type Test = (doc: Doc) => boolean;

/** Recursive descent over the tokens; attributes must be filterable, as on a real server. */
function parseFilter(filter: string, filterable: string[]): Test {
  const tokens = tokenize(filter);
  let at = 0;
  const peek = () => tokens[at];
  const next = () => tokens[at++];
  const value = (): string => {
    const t = next();
    if (t === undefined) throw new FilterError('value expected');
    return t.startsWith('\u0000') ? t.slice(1) : t;
  };
  const has = (doc: Doc, attribute: string, wanted: string) => {
    const v = doc[attribute];
    return (Array.isArray(v) ? v : [v]).some((x) => String(x) === wanted);
  };
  const condition = (): Test => {
    if (peek() === '(') {
      next();
      const inner = or();
      if (next() !== ')') throw new FilterError('missing )');
      return inner;
    }
    if (peek() === 'NOT') {
      next();
      const inner = condition();
      return (d) => !inner(d);
    }
    const attribute = value();
    if (!filterable.includes(attribute)) throw new FilterError(`Attribute \`${attribute}\` is not filterable.`);
    const op = next();
    if (op === 'IN') {
      if (next() !== '[') throw new FilterError('[ expected');
      const values: string[] = [];
      while (peek() !== ']') {
        values.push(value());
        if (peek() === ',') next();
        if (peek() === undefined) throw new FilterError('] expected');
      }
      next();
      return (d) => values.some((v) => has(d, attribute, v));
    }
    if (op !== '=' && op !== '!=') throw new FilterError(`operator expected after ${attribute}`);
    const wanted = value();
    return op === '=' ? (d) => has(d, attribute, wanted) : (d) => !has(d, attribute, wanted);
  };
  const and = (): Test => {
    const parts = [condition()];
    while (peek() === 'AND') {
      next();
      parts.push(condition());
    }
    return (d) => parts.every((p) => p(d));
  };
  const or = (): Test => {
    const parts = [and()];
    while (peek() === 'OR') {
      next();
      parts.push(and());
    }
    return (d) => parts.some((p) => p(d));
  };
  const test = or();
  if (at !== tokens.length) throw new FilterError(`unexpected ${tokens[at]}`);
  return test;
}

/** Meilisearch's array form: outer array AND-ed, inner arrays OR-ed. */
function filterTest(filter: unknown, filterable: string[]): Test {
  if (filter === undefined || filter === null || filter === '') return () => true;
  if (typeof filter === 'string') return parseFilter(filter, filterable);
  if (!Array.isArray(filter)) throw new FilterError('filter must be a string or an array');
  const parts = filter.map((f) =>
    Array.isArray(f) ? (d: Doc) => f.some((g) => parseFilter(String(g), filterable)(d)) : parseFilter(String(f), filterable),
  );
  return (d) => parts.every((p) => p(d));
}

const words = (text: string): string[] => text.toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? [];

function searchDocs(index: FakeIndex, body: Record<string, unknown>) {
  const filterable = (index.settings.filterableAttributes as string[] | undefined) ?? [];
  const searchable = (index.settings.searchableAttributes as string[] | undefined) ?? ['*'];
  const synonyms = (index.settings.synonyms as Record<string, string[]> | undefined) ?? {};
  const test = filterTest(body.filter, filterable);
  const queryWords = words(String(body.q ?? ''));
  const textOf = (d: Doc) =>
    words(
      Object.entries(d)
        .filter(([k]) => searchable.includes('*') || searchable.includes(k))
        .map(([, v]) => (Array.isArray(v) ? v.join(' ') : String(v)))
        .join(' '),
    );
  const matches = (d: Doc, w: string) => {
    const text = textOf(d);
    return [w, ...(synonyms[w] ?? [])].some((alt) => words(alt).every((part) => text.includes(part)));
  };
  const candidates = [...index.docs.values()].filter(test);
  let used = queryWords.length;
  let hits = candidates.filter((d) => queryWords.every((w) => matches(d, w)));
  while (hits.length === 0 && used > 1 && body.matchingStrategy !== 'all') {
    used--;
    hits = candidates.filter((d) => queryWords.slice(0, used).every((w) => matches(d, w)));
  }
  const score = (d: Doc) => (queryWords.length === 0 ? 1 : queryWords.filter((w) => matches(d, w)).length / queryWords.length);
  hits.sort(
    (a, b) => score(b) - score(a) || Number(b.benchRank ?? 0) - Number(a.benchRank ?? 0) || String(a.id).localeCompare(String(b.id)),
  );
  return { hits, score, queryWords };
}

function facetDistribution(hits: Doc[], facets: string[], filterable: string[]): Record<string, Record<string, number>> {
  const out: Record<string, Record<string, number>> = {};
  for (const facet of facets) {
    if (!filterable.includes(facet)) throw new FilterError(`Attribute \`${facet}\` is not filterable.`);
    const counts: Record<string, number> = {};
    for (const hit of hits)
      for (const v of [hit[facet]].flat()) if (v !== undefined && v !== null) counts[String(v)] = (counts[String(v)] ?? 0) + 1;
    out[facet] = counts;
  }
  return out;
}

function highlight(text: unknown, queryWords: string[], pre: string, post: string): unknown {
  if (typeof text !== 'string' || queryWords.length === 0) return text;
  return text.replace(/[\p{L}\p{N}]+/gu, (w) => (queryWords.includes(w.toLowerCase()) ? `${pre}${w}${post}` : w));
}

export class FakeMeili {
  readonly indexes = new Map<string, FakeIndex>();
  readonly tasks: FakeTask[] = [];
  readonly requests: RecordedRequest[] = [];
  private server: Server | null = null;
  port = 0;

  constructor(private readonly key?: string) {}

  get url(): string {
    return `http://127.0.0.1:${this.port}`;
  }

  async start(): Promise<void> {
    this.server = createServer((req, res) => void this.handle(req, res));
    await new Promise<void>((resolve) => this.server!.listen(this.port, '127.0.0.1', resolve));
    this.port = (this.server.address() as AddressInfo).port;
  }

  /** Stops answering (connections refused) but keeps every index: start() again plays a recovery. */
  async stop(): Promise<void> {
    const server = this.server;
    this.server = null;
    if (!server) return;
    server.closeAllConnections();
    await new Promise<void>((resolve) => server.close(() => resolve()));
  }

  private enqueue(indexUid: string | null, type: string, apply: () => void): { status: number; body: unknown } {
    const task: FakeTask = {
      uid: this.tasks.length,
      indexUid,
      status: 'succeeded',
      type,
      error: null,
      enqueuedAt: new Date().toISOString(),
    };
    try {
      apply();
    } catch (error) {
      task.status = 'failed';
      task.error = {
        code: (error as { code?: string }).code ?? 'internal',
        message: String((error as Error).message),
        type: 'invalid_request',
        link: '',
      };
    }
    this.tasks.push(task);
    return { status: 202, body: { taskUid: task.uid, indexUid, status: 'enqueued', type, enqueuedAt: task.enqueuedAt } };
  }

  private index(uid: string): FakeIndex {
    let index = this.indexes.get(uid);
    if (!index) this.indexes.set(uid, (index = { primaryKey: null, settings: {}, docs: new Map() }));
    return index;
  }

  private route(method: string, parts: string[], body: any, params: URLSearchParams): { status: number; body: unknown } {
    const [root, uid, section, sub] = parts;
    if (root === 'health') return { status: 200, body: { status: 'available' } };
    if (root === 'tasks' && uid !== undefined) {
      const task = this.tasks[Number(uid)];
      return task
        ? { status: 200, body: task }
        : { status: 404, body: { message: 'task not found', code: 'task_not_found', type: 'invalid_request', link: '' } };
    }
    if (root === 'swap-indexes' && method === 'POST') {
      return this.enqueue(null, 'indexSwap', () => {
        for (const swap of body as { indexes: [string, string] }[]) {
          const [a, b] = swap.indexes;
          const first = this.indexes.get(a);
          const second = this.indexes.get(b);
          if (!first || !second) throw Object.assign(new Error(`Indexes ${a} and ${b} must both exist.`), { code: 'index_not_found' });
          this.indexes.set(a, second);
          this.indexes.set(b, first);
        }
      });
    }
    if (root !== 'indexes') return { status: 404, body: { message: 'not found', code: 'not_found', type: 'invalid_request', link: '' } };
    if (method === 'POST' && uid === undefined) {
      return this.enqueue(body.uid, 'indexCreation', () => {
        if (this.indexes.has(body.uid))
          throw Object.assign(new Error(`Index \`${body.uid}\` already exists.`), { code: 'index_already_exists' });
        this.index(body.uid).primaryKey = body.primaryKey ?? null;
      });
    }
    if (uid === undefined) return { status: 405, body: {} };
    const existing = this.indexes.get(uid);
    if (section === undefined && method === 'DELETE') {
      return this.enqueue(uid, 'indexDeletion', () => {
        if (!this.indexes.delete(uid)) throw Object.assign(new Error(`Index \`${uid}\` not found.`), { code: 'index_not_found' });
      });
    }
    if (section === 'settings' && method === 'GET') return existing ? { status: 200, body: existing.settings } : notFound(uid);
    if (section === 'settings')
      return this.enqueue(uid, 'settingsUpdate', () =>
        Object.assign(this.index(uid).settings, sub === 'synonyms' ? { synonyms: body } : body),
      );
    if (section === 'documents' && method === 'POST' && sub === undefined) {
      return this.enqueue(uid, 'documentAdditionOrUpdate', () => {
        const index = this.index(uid);
        const key = params.get('primaryKey') ?? index.primaryKey ?? 'id';
        index.primaryKey ??= key;
        for (const doc of body as Doc[]) index.docs.set(String(doc[key]), doc);
      });
    }
    if (section === 'documents' && sub === 'delete-batch')
      return this.enqueue(uid, 'documentDeletion', () => (body as unknown[]).forEach((id) => this.index(uid).docs.delete(String(id))));
    if (section === 'documents' && method === 'DELETE') return this.enqueue(uid, 'documentDeletion', () => this.index(uid).docs.clear());
    if (section === 'search' && method === 'POST') return existing ? this.search(existing, body) : notFound(uid);
    if (section === undefined && method === 'GET')
      return existing ? { status: 200, body: { uid, primaryKey: existing.primaryKey } } : notFound(uid);
    return {
      status: 404,
      body: { message: `no route ${method} ${parts.join('/')}`, code: 'not_found', type: 'invalid_request', link: '' },
    };
  }

  private search(index: FakeIndex, body: Record<string, any>): { status: number; body: unknown } {
    try {
      const { hits, score, queryWords } = searchDocs(index, body);
      const filterable = (index.settings.filterableAttributes as string[] | undefined) ?? [];
      const offset = Number(body.offset ?? 0);
      const limit = Number(body.limit ?? 20);
      const retrieve = body.attributesToRetrieve as string[] | undefined;
      const page = hits.slice(offset, offset + limit).map((doc) => {
        const shown: Record<string, unknown> =
          retrieve && !retrieve.includes('*') ? Object.fromEntries(retrieve.filter((a) => a in doc).map((a) => [a, doc[a]])) : { ...doc };
        if (body.showRankingScore) shown._rankingScore = score(doc);
        if (body.attributesToHighlight) {
          shown._formatted = Object.fromEntries(
            (body.attributesToHighlight as string[]).map((a) => [
              a,
              highlight(doc[a], queryWords, body.highlightPreTag ?? '<em>', body.highlightPostTag ?? '</em>'),
            ]),
          );
        }
        return shown;
      });
      const facets = body.facets ? facetDistribution(hits, body.facets, filterable) : undefined;
      return {
        status: 200,
        body: {
          hits: page,
          query: body.q ?? '',
          offset,
          limit,
          estimatedTotalHits: hits.length,
          processingTimeMs: 0,
          ...(facets ? { facetDistribution: facets } : {}),
        },
      };
    } catch (error) {
      if (error instanceof FilterError)
        return { status: 400, body: { message: error.message, code: 'invalid_search_filter', type: 'invalid_request', link: '' } };
      throw error;
    }
  }

  private async handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const chunks: Buffer[] = [];
    for await (const chunk of req) chunks.push(chunk as Buffer);
    const text = Buffer.concat(chunks).toString('utf8');
    const body = text ? JSON.parse(text) : undefined;
    const url = new URL(req.url ?? '/', 'http://fake');
    this.requests.push({ method: req.method ?? 'GET', path: url.pathname + url.search, body });
    const send = (status: number, payload: unknown) => {
      res.writeHead(status, { 'Content-Type': 'application/json' });
      res.end(JSON.stringify(payload));
    };
    if (this.key && req.headers.authorization !== `Bearer ${this.key}`) {
      return send(401, { message: 'The provided API key is invalid.', code: 'invalid_api_key', type: 'auth', link: '' });
    }
    const { status, body: payload } = this.route(req.method ?? 'GET', url.pathname.split('/').filter(Boolean), body, url.searchParams);
    send(status, payload);
  }
}

function notFound(uid: string): { status: number; body: unknown } {
  return { status: 404, body: { message: `Index \`${uid}\` not found.`, code: 'index_not_found', type: 'invalid_request', link: '' } };
}

export async function startFakeMeili(key?: string): Promise<FakeMeili> {
  const fake = new FakeMeili(key);
  await fake.start();
  return fake;
}
