// The OpenAPI document names every route file under src/pages/api/v1 with every method it serves, and token rules stay narrow.
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { describe, expect, it } from 'vitest';
import { openApiDocument, openApiPath } from '@/server/openapi/document';
import { routeAccess } from '@/server/auth/route-access';
import { tokenMayCall } from '@/server/auth/api-tokens';

const apiDir = join(process.cwd(), 'src', 'pages', 'api', 'v1');

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return files(path);
    return entry.name.endsWith('.ts') && !entry.name.startsWith('_') ? [path] : [];
  });
}

/** src/pages/api/v1/job-sheets/[id].ts → /api/v1/job-sheets/[id]; index files drop their name. */
function patternOf(file: string): string {
  const path = relative(join(process.cwd(), 'src', 'pages'), file)
    .split(sep)
    .join('/')
    .replace(/\.ts$/, '');
  return `/${path.replace(/\/index$/, '')}`;
}

/** The methods a route file exports (export const GET: APIRoute ...). */
function exportedMethods(file: string): string[] {
  return [...readFileSync(file, 'utf8').matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1] as string);
}

describe('OpenAPI document', () => {
  const doc = openApiDocument();

  it('is OpenAPI 3.1 with the one error shape as a component', () => {
    expect(doc.openapi).toBe('3.1.0');
    const schemas = (doc.components as { schemas: Record<string, { properties: Record<string, unknown> }> }).schemas;
    expect(Object.keys(schemas.Error!.properties)).toEqual(['error']);
  });

  it('documents every method of every route file under src/pages/api/v1', () => {
    const routeFiles = files(apiDir);
    expect(routeFiles.length).toBeGreaterThan(30);
    const missing: string[] = [];
    for (const file of routeFiles) {
      const path = openApiPath(patternOf(file));
      for (const method of exportedMethods(file)) {
        if (!doc.paths[path]?.[method.toLowerCase()]) missing.push(`${method} ${path} (${relative(process.cwd(), file)})`);
      }
    }
    expect(missing, `missing from src/server/openapi/operations.ts:\n${missing.join('\n')}`).toEqual([]);
  });

  it('documents no operation the route table does not allow', () => {
    const extra: string[] = [];
    for (const [path, methods] of Object.entries(doc.paths)) {
      const pattern = Object.keys(routeAccess).find((p) => openApiPath(p) === path);
      for (const method of Object.keys(methods)) {
        if (!pattern || !routeAccess[pattern]!.methods[method.toUpperCase() as 'GET']) extra.push(`${method} ${path}`);
      }
    }
    expect(extra).toEqual([]);
  });

  it('marks each operation a token may call with its scope', () => {
    const op = doc.paths['/api/v1/job-sheets/{id}']!.patch as Record<string, unknown>;
    expect(op['x-token-scope']).toBe('bench_work');
    expect(op.security).toEqual([{ session: [] }, { bearer: ['bench_work'] }]);
    const moderation = doc.paths['/api/v1/proofing/{id}/proof']!.post as Record<string, unknown>;
    expect(moderation['x-token-scope']).toBeUndefined();
  });
});

describe('which routes take an API token', () => {
  it('never lets a token reach moderation, administration or account changes', () => {
    const all = ['read', 'bench_work', 'order_list'] as const;
    const refused = Object.entries(routeAccess).flatMap(([pattern, rule]) =>
      Object.entries(rule.methods)
        .filter(([, access]) => ['manage_account', 'proof', 'moderate', 'lock_fix', 'suspend_user', 'manage_users'].includes(access))
        .map(([method]) => ({ pattern, method, decision: tokenMayCall(pattern, method, all) })),
    );
    expect(refused.length).toBeGreaterThan(8);
    for (const r of refused) expect(r.decision, `${r.method} ${r.pattern}`).toEqual({ ok: false, reason: 'not_for_tokens' });
  });

  it('asks for the scope the route names', () => {
    expect(tokenMayCall('/api/v1/job-sheets', 'POST', ['bench_work'])).toEqual({ ok: true });
    expect(tokenMayCall('/api/v1/job-sheets', 'POST', ['read'])).toEqual({ ok: false, reason: 'missing_scope', scope: 'bench_work' });
    expect(tokenMayCall('/api/v1/order-list', 'PUT', ['order_list'])).toEqual({ ok: true });
    // Deleting a job sheet stays in the browser.
    expect(tokenMayCall('/api/v1/job-sheets/[id]', 'DELETE', ['bench_work'])).toEqual({ ok: false, reason: 'not_for_tokens' });
    expect(tokenMayCall('/api/v1/fixes', 'HEAD', ['read'])).toEqual({ ok: true });
  });
});
