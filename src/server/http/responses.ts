// The one JSON response and error shape of the API: { error: { code, message, fields? } }.
import type { z } from 'zod';
import { fieldErrors } from '@/lib/schemas/field-errors';

// Pages and endpoints take the field messages from here, beside the rest of the error shape.
export { fieldErrors };

export type ErrorCode =
  | 'bad_request'
  | 'unauthorised'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'too_many_requests'
  | 'payload_too_large'
  | 'unsupported_media_type'
  | 'internal';

const statusOf: Record<ErrorCode, number> = {
  bad_request: 400,
  unauthorised: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  too_many_requests: 429,
  internal: 500,
};

export interface ApiError {
  error: { code: ErrorCode; message: string; fields?: Record<string, string[]> };
}

export const cachePolicies = {
  /** Public pages and reads: shared caches may keep them briefly. */
  public: 'public, max-age=60, s-maxage=300, stale-while-revalidate=600',
  /** A proofed revision never changes. */
  immutable: 'public, max-age=86400, s-maxage=31536000, immutable',
  private: 'private, no-store',
} as const;

export function json(
  data: unknown,
  init: { status?: number; cache?: keyof typeof cachePolicies; headers?: Record<string, string> } = {},
): Response {
  return new Response(JSON.stringify(data), {
    status: init.status ?? 200,
    headers: { 'Content-Type': 'application/json; charset=utf-8', 'Cache-Control': cachePolicies[init.cache ?? 'public'], ...init.headers },
  });
}

export function apiError(code: ErrorCode, message: string, fields?: Record<string, string[]>): Response {
  const body: ApiError = { error: { code, message, ...(fields ? { fields } : {}) } };
  return json(body, { status: statusOf[code], cache: 'private' });
}

/** Parses URL search parameters with a schema; a failure is a ready 400 response. */
export function parseSearchParams<S extends z.ZodType>(
  schema: S,
  url: URL,
): { ok: true; data: z.infer<S> } | { ok: false; response: Response } {
  const raw: Record<string, string> = {};
  for (const [k, v] of url.searchParams) if (v !== '') raw[k] = v;
  const parsed = schema.safeParse(raw);
  if (parsed.success) return { ok: true, data: parsed.data };
  return { ok: false, response: apiError('bad_request', 'Some query parameters are not valid.', fieldErrors(parsed.error)) };
}
