// Small pieces every JSON endpoint shares: the signed-in user, a numeric route parameter, and the answer to a post.
import type { SessionUser } from '@/lib/permissions';
import { apiError, seeOther } from './responses';
import { respond, type Outcome } from './result';

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
  input: { kind: 'json' | 'form' },
  options: { status?: number; back: string; done?: string; errorParam?: string },
): Response {
  if (input.kind === 'form') {
    const target = new URL(outcome.ok ? (options.done ?? options.back) : options.back, 'http://local');
    if (!outcome.ok) target.searchParams.set(options.errorParam ?? 'error', outcome.code);
    return seeOther(`${target.pathname}${target.search}${target.hash}`);
  }
  return respond(outcome, { status: options.status ?? 200 });
}
