// Plain HTML forms: page forms run as Astro Actions through runFormAction (src/actions/), and the page turns
// the Action's answer into a 303 or the form shown again (formAnswer). The account-entry forms that carry
// Auth.js's session cookies (sign-in, sign-up) and the reset pair still post to their own page through runForm.
import { can, type Action, type SessionUser } from '@/lib/permissions';
import type { FormActionResult, FormRefusal } from '@/lib/form-fields';
import { readBody } from './body';
import { seeOther, statusOf } from './responses';
import type { Outcome } from './result';

/** What a page shows after a form came back: its messages and the values to fill in again. */
export interface ShownForm {
  status: number;
  fields: Record<string, string[]>;
  message?: string;
  values: Record<string, string>;
  /** What the handler read from the form, for fields that are more than one text (e.g. parts rows). */
  read?: Record<string, unknown>;
  retryAfterSeconds?: number;
}

/** Passwords and link tokens are never sent back to the browser. */
const isSecret = (name: string): boolean => /password|token/i.test(name);

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
  const values = Object.fromEntries(Object.entries(fields).filter(([key]) => !isSecret(key)));
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

/** A page form's Action answer: where the browser goes next, or the form refused with everything typed. */
export type PageFormResult = FormActionResult<{ location: string }>;

/** A page form's work: the signed-in member, the fields by name (last value wins) and the whole form. */
export type PageFormHandler = (user: SessionUser, fields: Record<string, string>, form: FormData) => Promise<Outcome<{ location: string }>>;

/**
 * The one body of a page form's Action. Actions are also reachable at /_actions/<name>, past the page's
 * route rule, so the permission is checked here again. A refusal keeps every text field as typed except
 * passwords and tokens; nothing goes into the address.
 */
export async function runFormAction(
  form: FormData,
  locals: { user: SessionUser | null },
  permission: Action,
  handler: PageFormHandler,
): Promise<PageFormResult> {
  const fields: Record<string, string> = {};
  for (const [name, value] of form.entries()) if (typeof value === 'string') fields[name] = value;
  const typed = Object.fromEntries(Object.entries(fields).filter(([name]) => !isSecret(name)));
  const refusal = (status: number, message: string, rest: Partial<FormRefusal> = {}): FormRefusal => ({
    saved: false,
    status,
    message,
    fields: {},
    typed,
    ...rest,
  });
  const user = locals.user;
  if (!user) return refusal(401, 'Nothing was saved: you are signed out. Sign in in another tab, then send the form again.');
  if (!can(user, permission)) return refusal(403, 'Nothing was saved: your account cannot do this. Your account page says what it can do.');
  const outcome = await handler(user, fields, form);
  if (outcome.ok) return { saved: true, location: outcome.value.location };
  const values = outcome.detail?.values;
  return refusal(statusOf[outcome.code], outcome.message, {
    fields: outcome.fields ?? {},
    ...(values && typeof values === 'object' ? { values: values as Record<string, unknown> } : {}),
    ...(outcome.retryAfterSeconds ? { retryAfterSeconds: outcome.retryAfterSeconds } : {}),
  });
}

/** What getActionResult gives a page: the handler's answer, or Astro's own error (oversized body, bad type). */
export interface ActionAnswer {
  data?: PageFormResult | undefined;
  error?: unknown;
}

/**
 * A page's next step after its form Actions ran: the 303 to a saved form's next page, the form to show again
 * (its status and Retry-After set on the page's response), or nothing on a GET. A POST that named no Action of
 * this page changes nothing and is answered 400 on the page: its forms all post to an Action.
 */
export function formAnswer(
  answer: ActionAnswer | undefined,
  page: { request: Request; response: { status?: number; headers: Headers } },
): { response: Response } | { shown: ShownForm | undefined } {
  if (!answer) {
    if (page.request.method !== 'POST') return { shown: undefined };
    const shown: ShownForm = { status: 400, fields: {}, values: {}, message: 'Nothing was saved: please send the form from this page.' };
    applyShown(page.response, shown);
    return { shown };
  }
  if (answer.error !== undefined) {
    const status = (answer.error as { status?: unknown }).status;
    // Astro refuses a body over its Action limit or of another type before the handler runs.
    if (status !== 413 && status !== 415) throw answer.error;
    const shown: ShownForm = {
      status,
      fields: {},
      values: {},
      message: status === 413 ? 'That form was far larger than this page sends.' : 'Please send the form from this page.',
    };
    applyShown(page.response, shown);
    return { shown };
  }
  const result = answer.data;
  if (!result) return { shown: undefined };
  if (result.saved) return { response: seeOther(result.location) };
  const shown: ShownForm = {
    status: result.status,
    fields: result.fields,
    values: result.typed,
    message: result.message,
    ...(result.values ? { read: result.values } : {}),
    ...(result.retryAfterSeconds ? { retryAfterSeconds: result.retryAfterSeconds } : {}),
  };
  applyShown(page.response, shown);
  return { shown };
}
