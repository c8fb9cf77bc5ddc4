// Reads a tool's text fields into typed values, collecting one error (with its example) per field.
import type { InputError, Result } from '@/lib/values/result';

export type FieldErrors<F extends string> = Partial<Record<F, InputError>>;

/** What a tool shows: nothing yet, what is still missing, what is wrong, or the result. */
export type Outcome<F extends string, R> =
  | { state: 'empty' }
  | { state: 'incomplete'; missing: F[] }
  | { state: 'invalid'; errors: FieldErrors<F>; general?: InputError }
  | { state: 'done'; result: R };

/** Longest text a field keeps; longer input is refused by the readers with their own message. */
export const MAX_FIELD_LENGTH = 400;

export class FormReader<F extends string> {
  readonly errors: FieldErrors<F> = {};
  readonly missing: F[] = [];
  private readonly fields: Readonly<Record<F, string>>;
  private readonly submitted: boolean;

  /** submitted: the reader asked for a result (a GET submission), so empty required fields are errors too. */
  constructor(fields: Readonly<Record<F, string>>, submitted: boolean) {
    this.fields = fields;
    this.submitted = submitted;
  }

  text(name: F): string {
    return (this.fields[name] ?? '').trim();
  }

  required<T>(name: F, read: (text: string) => Result<T>): T | undefined {
    const text = this.text(name);
    if (text === '' && !this.submitted) {
      this.missing.push(name);
      return undefined;
    }
    return this.keep(name, read(text));
  }

  optional<T>(name: F, read: (text: string) => Result<T>): T | undefined {
    const text = this.text(name);
    return text === '' ? undefined : this.keep(name, read(text));
  }

  /** Records an error found after reading (e.g. a rating without the voltage the tool needs). */
  flag(name: F, error: InputError): void {
    this.errors[name] ??= error;
  }

  /** A required piece that was not given: missing while the reader types, an error once they ask for the result. */
  absent(name: F, error: InputError): void {
    if (this.submitted) this.flag(name, error);
    else this.missing.push(name);
  }

  /** True when every field read cleanly and nothing required is missing. */
  get complete(): boolean {
    return Object.keys(this.errors).length === 0 && this.missing.length === 0;
  }

  /** The outcome when the form is not complete: empty, incomplete or invalid. */
  stopped<R>(): Outcome<F, R> {
    if (Object.keys(this.errors).length > 0) return { state: 'invalid', errors: this.errors };
    const anyText = (Object.keys(this.fields) as F[]).some((name) => this.text(name) !== '');
    return anyText ? { state: 'incomplete', missing: this.missing } : { state: 'empty' };
  }

  /** The outcome of the tool's own function: its error becomes a general one. */
  finish<R>(result: Result<R>): Outcome<F, R> {
    return result.ok ? { state: 'done', result: result.value } : { state: 'invalid', errors: {}, general: result.error };
  }

  private keep<T>(name: F, result: Result<T>): T | undefined {
    if (result.ok) return result.value;
    this.errors[name] = result.error;
    return undefined;
  }
}

/**
 * The fields a tool knows, read from a query string; unknown parameters are ignored, long ones cut.
 * submitted: the tool's own form sent the query. A form sends every field, empty ones too; a link (from a
 * fix's parts table, a shared address) carries only some, so its empty fields are still to be typed, not errors.
 */
export function fieldsFromQuery<F extends string>(
  names: readonly F[],
  query: URLSearchParams,
): { fields: Record<F, string>; submitted: boolean } {
  const fields = {} as Record<F, string>;
  for (const name of names) fields[name] = (query.get(name) ?? '').slice(0, MAX_FIELD_LENGTH);
  return { fields, submitted: names.every((name) => query.has(name)) };
}

/** The query string for the current fields, leaving out empty ones, for sharing and printing. */
export function queryFromFields<F extends string>(fields: Readonly<Record<F, string>>): string {
  const query = new URLSearchParams();
  for (const [name, value] of Object.entries(fields) as Array<[F, string]>) {
    if (value.trim() !== '') query.set(name, value);
  }
  return query.toString();
}
