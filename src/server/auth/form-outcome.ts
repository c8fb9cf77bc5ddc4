// What an account form handler hands back to its page: go somewhere, or show the form again with messages.
import { readForm } from './form-data';
export type FieldMessages = Record<string, string[]>;

export type FormOutcome =
  | { kind: 'redirect'; location: string; setCookies?: string[] }
  | { kind: 'form'; status: number; fields: FieldMessages; message?: string; retryAfterSeconds?: number };

export function redirectTo(location: string, setCookies?: string[]): FormOutcome {
  return { kind: 'redirect', location, ...(setCookies ? { setCookies } : {}) };
}

export function invalid(fields: FieldMessages, message = 'Please correct the fields marked below.'): FormOutcome {
  return { kind: 'form', status: 400, fields, message };
}

export function refused(status: number, message: string): FormOutcome {
  return { kind: 'form', status, fields: {}, message };
}

export function tooMany(retryAfterSeconds: number): FormOutcome {
  const minutes = Math.max(1, Math.ceil(retryAfterSeconds / 60));
  return {
    kind: 'form',
    status: 429,
    fields: {},
    retryAfterSeconds,
    message: `Too many attempts from here. Please wait about ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`,
  };
}

/** A 303 (so the browser follows with GET), carrying any cookies Auth.js set. */
export function redirectResponse(location: string, setCookies: string[] = []): Response {
  const headers = new Headers({ Location: location, 'Cache-Control': 'private, no-store' });
  for (const cookie of setCookies) headers.append('Set-Cookie', cookie);
  return new Response(null, { status: 303, headers });
}

/** What a page shows after a form came back: its messages and the values to fill in again. */
export interface ShownForm {
  status: number;
  fields: FieldMessages;
  message?: string;
  values: Record<string, string>;
  retryAfterSeconds?: number;
}

/**
 * Runs a page's form handler on a POST: a redirect becomes the Response to return; anything else is
 * the form to show again, with the status the page should answer with.
 */
export async function runForm(
  request: Request,
  handler: (fields: Record<string, string>) => Promise<FormOutcome>,
): Promise<{ response: Response } | { shown: ShownForm }> {
  const read = await readForm(request);
  if (!read.ok) {
    const status = read.reason === 'too_large' ? 413 : 400;
    const message = read.reason === 'too_large' ? 'That form was far larger than this page sends.' : 'Please send the form from this page.';
    return { shown: { status, fields: {}, message, values: {} } };
  }
  const outcome = await handler(read.fields);
  if (outcome.kind === 'redirect') return { response: redirectResponse(outcome.location, outcome.setCookies) };
  // Passwords are never sent back to the browser.
  const values = Object.fromEntries(Object.entries(read.fields).filter(([key]) => !/password|token/i.test(key)));
  return {
    shown: {
      status: outcome.status,
      fields: outcome.fields,
      values,
      ...(outcome.message ? { message: outcome.message } : {}),
      ...(outcome.retryAfterSeconds ? { retryAfterSeconds: outcome.retryAfterSeconds } : {}),
    },
  };
}

/** Sets the page's status (and Retry-After for a rate limit) from a form shown again. */
export function applyShown(response: { status?: number; headers: Headers }, shown: ShownForm): void {
  response.status = shown.status;
  if (shown.retryAfterSeconds) response.headers.set('Retry-After', String(shown.retryAfterSeconds));
}
