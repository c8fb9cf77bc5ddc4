// Outcomes of the writing and proofing services: a value, or an error the endpoint turns into the one error shape.
import type { SessionUser } from '@/lib/permissions';
import type { z } from 'zod';
import { readableMessage } from '@/lib/schemas/field-errors';
import { apiError, type ErrorCode } from './responses';

/** Who is writing or proofing: the signed-in user as the middleware loads it. */
export type Writer = Pick<SessionUser, 'id' | 'role' | 'verified'>;

export interface Failure {
  ok: false;
  code: ErrorCode;
  message: string;
  fields?: Record<string, string[]>;
  /** Extra data the caller shows beside the message (a 409 carries both versions). */
  detail?: Record<string, unknown>;
}

export type Outcome<T> = { ok: true; value: T } | Failure;

export function succeed<T>(value: T): Outcome<T> {
  return { ok: true, value };
}

export function refuse(code: ErrorCode, message: string, fields?: Record<string, string[]>, detail?: Record<string, unknown>): Failure {
  return { ok: false, code, message, ...(fields ? { fields } : {}), ...(detail ? { detail } : {}) };
}

/** The failure as an API response: the usual error shape, with any detail beside `error`. */
export function failureResponse(failure: Failure): Response {
  const response = apiError(failure.code, failure.message, failure.fields);
  if (!failure.detail) return response;
  return new Response(
    JSON.stringify({
      error: { code: failure.code, message: failure.message, ...(failure.fields ? { fields: failure.fields } : {}) },
      ...failure.detail,
    }),
    {
      status: response.status,
      headers: response.headers,
    },
  );
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
