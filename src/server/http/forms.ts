// Plain HTML forms a page handles itself (account, sign-in, admin): read the post, run the handler, answer.
import { readBody } from './body';
import { seeOther, statusOf } from './responses';
import type { Outcome } from './result';

/** What a page shows after a form came back: its messages and the values to fill in again. */
export interface ShownForm {
  status: number;
  fields: Record<string, string[]>;
  message?: string;
  values: Record<string, string>;
  retryAfterSeconds?: number;
}

/**
 * Runs a page's form handler on a POST: a redirect becomes the 303 to return; a refusal is the form to show
 * again, with the status the page should answer with.
 */
export async function runForm(
  request: Request,
  handler: (fields: Record<string, string>) => Promise<Outcome<{ location: string; setCookies?: string[] }>>,
): Promise<{ response: Response } | { shown: ShownForm }> {
  const read = await readBody(request, { form: 'account' });
  if (!read.ok || read.value.kind !== 'form') {
    const tooLarge = !read.ok && read.code === 'payload_too_large';
    const message = tooLarge ? 'That form was far larger than this page sends.' : 'Please send the form from this page.';
    return { shown: { status: tooLarge ? 413 : 400, fields: {}, message, values: {} } };
  }
  const fields = read.value.data;
  const outcome = await handler(fields);
  if (outcome.ok) return { response: seeOther(outcome.value.location, outcome.value.setCookies) };
  // Passwords are never sent back to the browser.
  const values = Object.fromEntries(Object.entries(fields).filter(([key]) => !/password|token/i.test(key)));
  return {
    shown: {
      status: statusOf[outcome.code],
      fields: outcome.fields ?? {},
      values,
      message: outcome.message,
      ...(outcome.retryAfterSeconds ? { retryAfterSeconds: outcome.retryAfterSeconds } : {}),
    },
  };
}

/** Sets the page's status (and Retry-After for a rate limit) from a form shown again. */
export function applyShown(response: { status?: number; headers: Headers }, shown: ShownForm): void {
  response.status = shown.status;
  if (shown.retryAfterSeconds) response.headers.set('Retry-After', String(shown.retryAfterSeconds));
}
