// The OpenAPI 3.1 document of /api/v1, built from operations.ts and the zod schemas the endpoints parse with.
import { OpenAPIRegistry, OpenApiGeneratorV31, type ResponseConfig, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { routeAccess } from '../auth/route-access';
import { errorResponseSchema } from './responses';
import { tokenScopeLabels, tokenScopes } from '@/lib/schemas/api-tokens';
import { operations, type Operation } from './operations';

/** Astro's /api/v1/job-sheets/[id] is OpenAPI's /api/v1/job-sheets/{id}. */
export function openApiPath(pattern: string): string {
  return pattern.replace(/\[\.{0,3}([^\]]+)\]/g, '{$1}');
}

const paramExamples: Record<string, { description: string; example: string }> = {
  id: { description: 'The number of the record.', example: '42' },
  slug: { description: 'The address name, e.g. of a machine, chassis family or fix.', example: 'tl2-tray-will-not-open-e21' },
  code: { description: "The note's code as printed on the invoice (spaces and case do not matter).", example: '7KQ2MX9P4H' },
};

function pathParams(pattern: string): z.ZodObject | undefined {
  const names = [...pattern.matchAll(/\[([^\]]+)\]/g)].map((m) => m[1] as string);
  if (names.length === 0) return undefined;
  return z.object(Object.fromEntries(names.map((name) => [name, z.string().meta(paramExamples[name] ?? { description: name })])));
}

const errorContent = { 'application/json': { schema: errorResponseSchema } };
const errorText: Record<number, string> = {
  400: 'The input is not valid: `error.fields` names each field with a sentence and an example.',
  401: 'Not signed in, or the API token is not valid or was revoked.',
  403: 'The account may not do this, the token lacks the scope, the address never takes a token, or the account is suspended.',
  404: 'Not found, or not yours (answered alike).',
  409: 'Conflicts with the current state; both versions are sent beside `error`.',
  410: 'Withdrawn.',
  412: 'The record changed since the version in If-Match: the current one is sent as `current` beside `error`.',
  413: 'The body is larger than this address takes.',
  415: 'Send the body as the content type shown.',
  428: 'This change needs an If-Match header with the ETag you read (with an API token).',
  429: 'Too many requests: wait for the seconds in Retry-After.',
};
const etagHeader = {
  ETag: { description: 'The record\'s version, e.g. "v3": send it back in If-Match.', schema: { type: 'string' as const } },
};

function responsesOf(op: Operation, tokenScope: string | undefined, guarded: boolean): RouteConfig['responses'] {
  const ok: ResponseConfig = { description: op.ok.description };
  if (op.ok.schema) ok.content = { [op.ok.type ?? 'application/json']: { schema: op.ok.schema } };
  else if (op.ok.type) ok.content = { [op.ok.type]: { schema: z.string() } };
  if (op.ok.etag) ok.headers = etagHeader;
  const responses: RouteConfig['responses'] = { [op.ok.status]: ok };
  const statuses = new Set(op.errors ?? []);
  if (guarded || tokenScope) [401, 403].forEach((s) => statuses.add(s));
  if (tokenScope) statuses.add(429);
  for (const status of [...statuses].sort()) {
    const content = status === 412 && op.stale ? { 'application/json': { schema: op.stale } } : errorContent;
    responses[status] = {
      description: errorText[status] ?? 'An error.',
      content,
      ...(status === 429 ? { headers: { 'Retry-After': { description: 'Seconds to wait.', schema: { type: 'integer' as const } } } } : {}),
    };
  }
  return responses;
}

function registerOperation(registry: OpenAPIRegistry, op: Operation): void {
  const rule = routeAccess[op.pattern];
  const access = rule?.methods[op.method] ?? rule?.methods['*'];
  const tokenScope = rule?.token?.[op.method];
  const guarded = access !== undefined && access !== 'public';
  const request: RouteConfig['request'] = {};
  const params = pathParams(op.pattern);
  if (params) request.params = params;
  if (op.query) request.query = op.query as z.ZodObject;
  if (op.body) request.body = { required: true, content: { [op.body.type ?? 'application/json']: { schema: op.body.schema } } };
  if (op.method === 'PATCH' && op.stale)
    request.headers = z.object({
      'If-Match': z.string().optional().meta({ description: 'The ETag you read, e.g. "v3". Required with an API token.' }),
    });
  const who = access === 'public' ? 'Anyone.' : `Signed in, with the right to ${String(access).replace(/_/g, ' ')}.`;
  const byToken = tokenScope
    ? ` An API token with the \`${tokenScope}\` scope may call it.`
    : ' API tokens are refused here: use it from the browser, signed in.';
  const security: RouteConfig['security'] = [];
  if (guarded) security.push({ session: [] });
  if (tokenScope) security.push({ bearer: [tokenScope] });
  if (!guarded) security.push({});
  registry.registerPath({
    method: op.method.toLowerCase() as RouteConfig['method'],
    path: openApiPath(op.pattern),
    tags: [op.tag],
    summary: op.summary,
    description: [op.description, `Who: ${who}${byToken}`].filter(Boolean).join('\n\n'),
    request,
    responses: responsesOf(op, tokenScope, guarded),
    security,
    ...(tokenScope ? { 'x-token-scope': tokenScope } : {}),
  });
}

export interface OpenApiDocument {
  openapi: string;
  paths: Record<string, Record<string, unknown>>;
  [key: string]: unknown;
}

let built: OpenApiDocument | null = null;

/** The document, built once per process (it depends on code only). */
export function openApiDocument(): OpenApiDocument {
  if (built) return built;
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'bearer', {
    type: 'http',
    scheme: 'bearer',
    description: `A personal API token from your account page (it starts with blt_). Scopes: ${tokenScopes.map((s) => `\`${s}\` (${tokenScopeLabels[s]})`).join(', ')}.`,
  });
  registry.registerComponent('securitySchemes', 'session', {
    type: 'apiKey',
    in: 'cookie',
    name: 'authjs.session-token',
    description: "The browser's sign-in session.",
  });
  for (const op of operations) registerOperation(registry, op);
  const generator = new OpenApiGeneratorV31(registry.definitions);
  built = generator.generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Benchlore API',
      version: '1',
      description:
        'Read the catalogue and fixes, and keep job sheets, hand-over notes and your order list from your own programs. Every error has one shape: `{ "error": { "code", "message", "fields"? } }`.',
      license: { name: 'Fix texts: CC BY-SA 4.0', identifier: 'CC-BY-SA-4.0' },
    },
    servers: [{ url: '/' }],
    tags: [],
  }) as unknown as OpenApiDocument;
  return built;
}
