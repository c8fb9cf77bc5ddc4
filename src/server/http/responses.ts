// The one JSON response and error shape of the API: { error: { code, message, fields? } }.
import { fieldErrors } from '@/lib/schemas/field-errors';

// Pages and endpoints take the field messages from here, beside the rest of the error shape.
export { fieldErrors };

export type ErrorCode =
  | 'bad_request'
  | 'unauthorised'
  | 'forbidden'
  | 'not_found'
  | 'method_not_allowed'
  | 'conflict'
  | 'gone'
  | 'precondition_failed'
  | 'precondition_required'
  | 'too_many_requests'
  | 'payload_too_large'
  | 'unsupported_media_type'
  | 'internal'
  | 'unavailable';

export const statusOf: Record<ErrorCode, number> = {
  bad_request: 400,
  unauthorised: 401,
  forbidden: 403,
  not_found: 404,
  method_not_allowed: 405,
  conflict: 409,
  gone: 410,
  precondition_failed: 412,
  precondition_required: 428,
  payload_too_large: 413,
  unsupported_media_type: 415,
  too_many_requests: 429,
  internal: 500,
  unavailable: 503,
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
  /** Public, but every view must reach us (a search that found nothing is counted as a miss each time). */
  counted: 'no-cache',
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

/**
 * The one error answer: `{ error: { code, message, fields? } }` with the code's status, never cached. `extra` sits
 * beside `error` (a 409 carries both versions); `headers` adds e.g. Retry-After or Allow.
 */
export function apiError(
  code: ErrorCode,
  message: string,
  fields?: Record<string, string[]>,
  options: { extra?: Record<string, unknown>; headers?: Record<string, string> } = {},
): Response {
  const body: ApiError = { error: { code, message, ...(fields ? { fields } : {}) } };
  return json(
    { ...body, ...options.extra },
    { status: statusOf[code], cache: 'private', ...(options.headers ? { headers: options.headers } : {}) },
  );
}

/** The answer to a form post: 303 so the browser follows with GET, never cached; cookies (Auth.js) ride along. */
export function seeOther(location: string, setCookies: string[] = []): Response {
  const headers = new Headers({ Location: location, 'Cache-Control': 'private, no-store' });
  for (const cookie of setCookies) headers.append('Set-Cookie', cookie);
  return new Response(null, { status: 303, headers });
}
