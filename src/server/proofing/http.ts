// Request and response helpers for the writing and proofing endpoints: JSON or plain form posts, capped bodies.
import type { SessionUser } from '@/lib/permissions';
import { apiError, json } from '../http/responses';
import { failureResponse, refuse, type Failure, type Outcome } from '../http/result';

/** A draft with a long remedy and its tables stays well under this; anything larger is refused unread. */
export const MAX_JSON_BYTES = 2 * 1024 * 1024;
const MAX_FORM_BYTES = 64 * 1024;

export interface ReadInput {
  /** True for a plain HTML form post (urlencoded): the answer is then a redirect, not JSON. */
  form: boolean;
  data: unknown;
}

async function readCapped(request: Request, maxBytes: number): Promise<string | null> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > maxBytes) return null;
  if (!request.body) return '';
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.length;
    if (total > maxBytes) {
      await reader.cancel();
      return null;
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString('utf8');
}

/** Reads a JSON body or a urlencoded form; anything else is refused with 415. */
export async function readInput(request: Request): Promise<ReadInput | Failure> {
  const type = (request.headers.get('content-type') ?? '').toLowerCase();
  const form = type.startsWith('application/x-www-form-urlencoded');
  if (!form && !type.startsWith('application/json'))
    return refuse('unsupported_media_type', 'Send JSON (Content-Type: application/json) or a form.');
  const text = await readCapped(request, form ? MAX_FORM_BYTES : MAX_JSON_BYTES);
  if (text === null) return refuse('payload_too_large', 'The request is too large. A fix this long should be split into two fixes.');
  if (form) return { form, data: Object.fromEntries(new URLSearchParams(text)) };
  if (text.trim() === '') return { form, data: {} };
  try {
    return { form, data: JSON.parse(text) as unknown };
  } catch {
    return refuse('bad_request', 'The request body is not valid JSON; nothing was changed.');
  }
}

export function isFailure(value: unknown): value is Failure {
  return typeof value === 'object' && value !== null && (value as Failure).ok === false;
}

/** The signed-in user, or a 401 answer. */
export function requireUser(locals: App.Locals): SessionUser | Response {
  return locals.user ?? apiError('unauthorised', 'Sign in to do this.');
}

/** A positive integer from a route parameter, or null. */
export function idParam(value: string | undefined): number | null {
  if (!value || !/^\d{1,9}$/.test(value)) return null;
  const id = Number(value);
  return id >= 1 ? id : null;
}

/**
 * Answers a JSON caller with the outcome (or the error shape), and a form post with a 303 back to a page, carrying
 * only the error code in the query: the page shows a fixed sentence for it (src/lib/form-answers.ts), never text
 * from the address.
 */
export function answer<T>(
  outcome: Outcome<T>,
  input: { form: boolean },
  options: { status?: number; back: string; done?: string; errorParam?: string },
): Response {
  if (input.form) {
    const target = new URL(outcome.ok ? (options.done ?? options.back) : options.back, 'http://local');
    if (!outcome.ok) target.searchParams.set(options.errorParam ?? 'error', outcome.code);
    return new Response(null, {
      status: 303,
      headers: { Location: `${target.pathname}${target.search}${target.hash}`, 'Cache-Control': 'private, no-store' },
    });
  }
  if (!outcome.ok) return failureResponse(outcome);
  return json(outcome.value ?? { ok: true }, { status: options.status ?? 200, cache: 'private' });
}
