// The one result shape of the value decoder and the bench tools: a value, or an error that shows what is expected.

/** What went wrong in plain words, and an example of input that would have worked. */
export interface InputError {
  message: string;
  example: string;
}

export type Result<T> = { ok: true; value: T } | { ok: false; error: InputError };

export function ok<T>(value: T): Result<T> {
  return { ok: true, value };
}

export function fail<T = never>(message: string, example: string): Result<T> {
  return { ok: false, error: { message, example } };
}
