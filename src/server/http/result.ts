// The one result of server work: a value, or a refusal the endpoint or page turns into the one error shape.
import type { SessionUser } from '@/lib/permissions';
import type { z } from 'zod';
import type { InputError } from '@/lib/values/result';
import { fieldErrors, readableMessage } from '@/lib/schemas/field-errors';
import { apiError, json, type cachePolicies, type ErrorCode } from './responses';

/** Who is writing or proofing: the signed-in user as the middleware loads it. */
export type Writer = Pick<SessionUser, 'id' | 'role' | 'verified'>;

/** Why not, in a sentence with an example, with the messages by field and anything the caller shows beside them. */
export interface Failure {
  ok: false;
  code: ErrorCode;
  message: string;
  fields?: Record<string, string[]>;
  /** Extra data the caller shows beside the message (a 409 carries both versions). */
  detail?: Record<string, unknown>;
  /** For a rate limit: how long until the next try is counted again (the Retry-After header). */
  retryAfterSeconds?: number;
  /** Headers the answer carries, e.g. Connection: close after an oversized body the reader stopped reading. */
  headers?: Record<string, string>;
}

export type Outcome<T> = { ok: true; value: T } | Failure;

export function succeed<T>(value: T): Outcome<T> {
  return { ok: true, value };
}

export function refuse(
  code: ErrorCode,
  message: string,
  fields?: Record<string, string[]>,
  detail?: Record<string, unknown>,
  retryAfterSeconds?: number,
): Failure {
  return {
    ok: false,
    code,
    message,
    ...(fields ? { fields } : {}),
    ...(detail ? { detail } : {}),
    ...(retryAfterSeconds !== undefined ? { retryAfterSeconds } : {}),
  };
}

/**
 * The one way an outcome becomes an API response: the value as JSON (status 200 unless told, never cached unless
 * told), or the error shape with any detail beside `error` and a Retry-After header for a rate limit.
 */
export function respond<T>(outcome: Outcome<T>, init: { status?: number; cache?: keyof typeof cachePolicies } = {}): Response {
  if (outcome.ok) return json(outcome.value ?? { ok: true }, { status: init.status ?? 200, cache: init.cache ?? 'private' });
  const headers: Record<string, string> = { ...outcome.headers };
  if (outcome.retryAfterSeconds !== undefined) headers['Retry-After'] = String(outcome.retryAfterSeconds);
  return apiError(outcome.code, outcome.message, outcome.fields, { ...(outcome.detail ? { extra: outcome.detail } : {}), headers });
}

/**
 * Groups zod issues and our own rule checks into field messages keyed by dotted path. A zod issue still in the
 * validator's own wording is rewritten by the one readable-message function, so none reaches a person raw.
 */
export function issuesToFields(issues: { path: PropertyKey[]; message: string; code?: string }[]): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_';
    const message = issue.code ? readableMessage(issue as z.core.$ZodIssue) : issue.message;
    (fields[key] ??= []).push(message);
  }
  return fields;
}

/** "… For example: 4.7 µF, 4u7, 100nF or 104": the one sentence a bench tool's field message carries. */
function withExample(error: InputError): string {
  return `${error.message} For example: ${error.example}`;
}

/** A bench tool's own refusal (bad value, rating or combination), naming the field at fault. */
export function inputRefusal(field: string, error: InputError): Failure {
  return refuse('bad_request', withExample(error), { [field]: [withExample(error)] });
}

/** A schema failure with every field's message, and the example of a whole good body. */
export function schemaRefusal(error: z.ZodError, example: string): Failure {
  const first = error.issues[0];
  const where = first && first.path.length > 0 ? `${first.path.join('.')}: ` : '';
  return refuse(
    'bad_request',
    `${where}${first ? readableMessage(first) : 'The input is not valid.'} For example: ${example}`,
    fieldErrors(error),
  );
}

/** Parses URL search parameters with a schema (blank ones left out); a failure names each parameter at fault. */
export function parseSearchParams<S extends z.ZodType>(schema: S, url: URL): Outcome<z.infer<S>> {
  const raw: Record<string, string> = {};
  for (const [k, v] of url.searchParams) if (v !== '') raw[k] = v;
  const parsed = schema.safeParse(raw);
  if (parsed.success) return succeed(parsed.data);
  return refuse('bad_request', 'Some query parameters are not valid.', fieldErrors(parsed.error));
}
