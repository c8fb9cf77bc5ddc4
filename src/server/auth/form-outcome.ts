// What an account form handler hands back to its page: go somewhere, or a refusal the page shows beside the form.
import { statusOf, type ErrorCode } from '../http/responses';
import { refuse, succeed, type Failure, type Outcome } from '../http/result';

export type FieldMessages = Record<string, string[]>;

/** Where the browser goes next, with any cookies Auth.js set on the way. */
export interface Redirect {
  location: string;
  setCookies?: string[];
}

export type FormOutcome = Outcome<Redirect>;

export function redirectTo(location: string, setCookies?: string[]): FormOutcome {
  return succeed({ location, ...(setCookies ? { setCookies } : {}) });
}

export function invalid(fields: FieldMessages, message = 'Please correct the fields marked below.'): FormOutcome {
  return refuse('bad_request', message, fields);
}

/** A refusal by its HTTP status, e.g. 410 for a reset link already used. */
export function refused(status: number, message: string): FormOutcome {
  const code = (Object.keys(statusOf) as ErrorCode[]).find((name) => statusOf[name] === status) ?? 'internal';
  return refuse(code, message);
}

/** A used-up rate limit, as the limit itself worded it. */
export function tooMany(limit: Failure): FormOutcome {
  return limit;
}
