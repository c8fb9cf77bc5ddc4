// Personal API tokens: created and revoked by their member, stored only as a SHA-256 hash, sent as
// `Authorization: Bearer blt_…`. The one rule of which route a token may call lives here (tokenMayCall),
// reading each route's `token` entry in route-access.ts.
import { createHash, randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { db } from '../core/db';
import { refuse, succeed, type Outcome } from '../http/result';
import { consume } from '../http/rate-limit';
import { loadSessionUser } from './users';
import { decideRoute, routeAccess, type RouteMethod } from './route-access';
import type { SessionUser } from '@/lib/permissions';
import {
  TOKEN_PREFIX,
  apiTokenCreateSchema,
  tokenScopes,
  type ApiTokenCreate,
  type ApiTokenView,
  type TokenScope,
} from '@/lib/schemas/api-tokens';

export type { ApiTokenView };
import { fieldErrors } from '@/lib/schemas/field-errors';

/** A member may keep this many live tokens: one per program is the usual case. */
export const MAX_LIVE_TOKENS = 20;

/** The token a request was made with, on Astro.locals beside the user. */
export interface RequestToken {
  id: number;
  scopes: TokenScope[];
}

function hashOf(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
function toView(row: any): ApiTokenView {
  return {
    id: row.id,
    name: row.name,
    scopes: row.scopes,
    hint: row.hint,
    createdAt: row.created_at,
    lastUsedAt: row.last_used_at,
    revokedAt: row.revoked_at,
  };
}

/** The member's tokens, live ones first, newest first. */
export async function listApiTokens(userId: number, knex: Knex = db()): Promise<ApiTokenView[]> {
  const rows = await knex('api_tokens')
    .where({ user_id: userId })
    .orderByRaw('revoked_at IS NOT NULL, created_at DESC, id DESC')
    .select('id', 'name', 'scopes', 'hint', 'created_at', 'last_used_at', 'revoked_at');
  return rows.map(toView);
}

/** A new token: the plain text is returned once and never stored. */
export async function createApiToken(
  userId: number,
  input: ApiTokenCreate,
  knex: Knex = db(),
): Promise<Outcome<{ token: string; view: ApiTokenView }>> {
  const live = await knex('api_tokens').where({ user_id: userId }).whereNull('revoked_at').count<{ count: string }[]>('id as count');
  if (Number(live[0]?.count ?? 0) >= MAX_LIVE_TOKENS)
    return refuse('conflict', `You have ${MAX_LIVE_TOKENS} live tokens. Revoke one you no longer use, e.g. an old program's, first.`);
  const secret = randomBytes(32).toString('base64url');
  const token = `${TOKEN_PREFIX}${secret}`;
  const [row] = await knex('api_tokens')
    .insert({
      user_id: userId,
      name: input.name,
      scopes: input.scopes,
      hint: `${TOKEN_PREFIX}${secret.slice(0, 4)}…`,
      token_hash: hashOf(token),
    })
    .returning(['id', 'name', 'scopes', 'hint', 'created_at', 'last_used_at', 'revoked_at']);
  return succeed({ token, view: toView(row) });
}

/** Revokes one of the member's tokens; false when they have no live token with that id. */
export async function revokeApiToken(userId: number, tokenId: number, knex: Knex = db()): Promise<boolean> {
  const updated = await knex('api_tokens')
    .where({ id: tokenId, user_id: userId })
    .whereNull('revoked_at')
    .update({ revoked_at: knex.fn.now() });
  return updated > 0;
}

/** The bearer token of a request, or null when it carries none (a browser with its cookie). */
export function bearerOf(request: Request): string | null {
  const header = request.headers.get('authorization');
  if (!header) return null;
  const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
  return match?.[1] ?? '';
}

/**
 * Whether a token with these scopes may call this route and method: only routes whose entry in route-access.ts
 * names a token scope for the method take a token at all. Moderation, administration and account changes name
 * none, and the actions below are refused even if an entry ever named one.
 */
const neverByToken = new Set([
  'manage_account',
  'proof',
  'moderate',
  'lock_fix',
  'hide_fix',
  'suspend_user',
  'manage_users',
  'manage_settings',
  'view_audit_log',
  'curate_catalogue',
  'manage_word_families',
]);

export type TokenRouteDecision = { ok: true } | { ok: false; reason: 'not_for_tokens' | 'missing_scope'; scope?: TokenScope };

export function tokenMayCall(pattern: string, method: string, scopes: readonly TokenScope[]): TokenRouteDecision {
  const decision = decideRoute(pattern, method);
  if (decision.kind !== 'access' || decision.access === 'closed') return { ok: false, reason: 'not_for_tokens' };
  if (neverByToken.has(decision.access)) return { ok: false, reason: 'not_for_tokens' };
  const upper = method.toUpperCase() === 'HEAD' ? 'GET' : (method.toUpperCase() as RouteMethod);
  const scope = routeAccess[pattern]?.token?.[upper];
  if (!scope) return { ok: false, reason: 'not_for_tokens' };
  return scopes.includes(scope) ? { ok: true } : { ok: false, reason: 'missing_scope', scope };
}

const notForTokens =
  'API tokens cannot call this address: it is for the browser, signed in. Moderation and account changes never take a token.';

/**
 * Authenticates a request that carries `Authorization: Bearer …`: the token must be live, its account active,
 * the route open to tokens with one of its scopes, and the token within its rate limit. Returns the user and
 * token for Astro.locals, or the refusal to answer with.
 */
export async function authenticateBearer(
  token: string,
  route: { pattern: string; method: string },
  knex: Knex = db(),
): Promise<Outcome<{ user: SessionUser; token: RequestToken }>> {
  const unknown = refuse(
    'unauthorised',
    'That API token is not valid or has been revoked. Create a new one on your account page; it starts with blt_.',
  );
  if (!token.startsWith(TOKEN_PREFIX) || token.length > 200) return unknown;
  const row = await knex('api_tokens')
    .where({ token_hash: hashOf(token) })
    .first('id', 'user_id', 'scopes', 'revoked_at');
  if (!row || row.revoked_at) return unknown;
  const lookup = await loadSessionUser(row.user_id, Date.now(), knex);
  if (!lookup.user)
    return lookup.reason === 'suspended'
      ? refuse('forbidden', 'This account is suspended: its API tokens do not work until the suspension ends.')
      : unknown;
  const scopes = (row.scopes as string[]).filter((s): s is TokenScope => (tokenScopes as readonly string[]).includes(s));
  const may = tokenMayCall(route.pattern, route.method, scopes);
  if (!may.ok)
    return refuse(
      'forbidden',
      may.reason === 'missing_scope'
        ? `This token lacks the "${may.scope}" scope this address needs. Create a token with it on your account page.`
        : notForTokens,
    );
  const limit = await consume('api_token', { account: `token:${row.id}` });
  if (!limit.ok) return limit;
  // Last used, to the minute: one write a minute per token at most.
  await knex('api_tokens')
    .where({ id: row.id })
    .where((q) => q.whereNull('last_used_at').orWhere('last_used_at', '<', knex.raw("now() - interval '1 minute'")))
    .update({ last_used_at: knex.fn.now() });
  return succeed({ user: lookup.user, token: { id: row.id, scopes } });
}

export type TokenFormResult =
  | { kind: 'created'; token: string; view: ApiTokenView }
  | { kind: 'revoked' }
  | { kind: 'refused'; status: number; message: string; fields: Record<string, string[]>; values: { name: string; scopes: string[] } };

/** The token page's two forms: create (name and ticked scopes) and revoke (a token's id). */
export async function handleApiTokenForm(userId: number, form: URLSearchParams): Promise<TokenFormResult> {
  const values = { name: form.get('name') ?? '', scopes: form.getAll('scopes') };
  if (form.get('intent') === 'revoke') {
    const id = Number(form.get('id'));
    if (Number.isSafeInteger(id) && id > 0 && (await revokeApiToken(userId, id))) return { kind: 'revoked' };
    return { kind: 'refused', status: 404, message: 'That token was already revoked, or is not yours.', fields: {}, values };
  }
  const parsed = apiTokenCreateSchema.safeParse(values);
  if (!parsed.success)
    return {
      kind: 'refused',
      status: 400,
      message: 'The token was not created: check the fields marked below.',
      fields: fieldErrors(parsed.error),
      values,
    };
  const created = await createApiToken(userId, parsed.data);
  if (!created.ok) return { kind: 'refused', status: 409, message: created.message, fields: {}, values };
  return { kind: 'created', ...created.value };
}
