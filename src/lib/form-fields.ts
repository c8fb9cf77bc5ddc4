// Reading plain HTML forms: trimmed text, numbers, repeated rows and fix addresses, and a refused form's
// answer with everything typed, for the Actions and the pages that show them again.
import { slugSchema } from './schemas/slug';

/** What the form readers need of a submitted form: FormData and URLSearchParams both have it. */
export interface FormFields {
  get(name: string): FormDataEntryValue | null;
  keys(): IterableIterator<string> | Iterable<string>;
}

/** Plain HTML forms send text: a trimmed value, or undefined when the field is missing or blank. */
export function formText(form: FormFields, name: string): string | undefined {
  const value = form.get(name);
  if (typeof value !== 'string') return undefined;
  const trimmed = value.trim();
  return trimmed === '' ? undefined : trimmed;
}

/** A number typed into a form: undefined when blank, NaN (which the schema names) when not a number. */
export function formNumber(form: FormFields, name: string): number | undefined {
  const text = formText(form, name);
  return text === undefined ? undefined : Number(text);
}

/**
 * Repeated rows of a form, named `prefix.0.field`, `prefix.1.field`, ...; rows left entirely blank are
 * dropped, so a form can offer a few empty rows for new entries without JavaScript.
 */
export function formRows(form: FormFields, prefix: string, fields: readonly string[]): Record<string, string>[] {
  const indexes = new Set<number>();
  for (const key of form.keys()) {
    const match = new RegExp(`^${prefix}\\.(\\d{1,3})\\.`).exec(key);
    if (match) indexes.add(Number(match[1]));
  }
  const rows: Record<string, string>[] = [];
  for (const index of [...indexes].sort((a, b) => a - b)) {
    const row: Record<string, string> = {};
    for (const field of fields) row[field] = formText(form, `${prefix}.${index}.${field}`) ?? '';
    if (Object.values(row).some((v) => v !== '')) rows.push(row);
  }
  return rows;
}

/**
 * A fix named the way a member has it to hand: its address ("tl2-tray-will-not-open-e21"), a link to it,
 * or a link to one revision ("https://.../fixes/<slug>/r/3"). Null when it names no fix.
 */
export function fixRefFromText(text: string | undefined): { slug: string; revision?: number } | null {
  if (!text) return null;
  const trimmed = text.trim();
  const linked = /\/fixes\/([a-z0-9]+(?:-[a-z0-9]+)*)(?:\/r\/(\d{1,6}))?\/?(?:[?#].*)?$/.exec(trimmed);
  if (linked?.[1]) return linked[2] ? { slug: linked[1], revision: Number(linked[2]) } : { slug: linked[1] };
  return slugSchema.safeParse(trimmed).success ? { slug: trimmed } : null;
}

/** What a member typed into a bench report form, field by field, untrimmed. */
export type TypedForm = Record<string, string>;

/** The named fields of a posted form as typed (files and missing fields left out). */
export function typedFields(form: FormFields, names: readonly string[]): TypedForm {
  const typed: TypedForm = {};
  for (const name of names) {
    const value = form.get(name);
    if (typeof value === 'string') typed[name] = value;
  }
  return typed;
}

/**
 * The answer of a form Action, rendered by the page that posted it: saved, or refused with the message,
 * the messages by field and everything typed, so nothing travels through the address and nothing is lost.
 */
export type FormActionResult<Saved> = ({ saved: true } & Saved) | FormRefusal;

/** A refused form as its page shows it again. */
export interface FormRefusal {
  saved: false;
  status: number;
  message: string;
  fields: Record<string, string[]>;
  typed: TypedForm;
  /** Values the handler read from the form (e.g. a job sheet's parts rows), to fill the fields in again. */
  values?: Record<string, unknown>;
  /** For a rate limit: seconds until the next try counts (the page's Retry-After header). */
  retryAfterSeconds?: number;
}
