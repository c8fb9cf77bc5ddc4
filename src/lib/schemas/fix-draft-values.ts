// The fix form's plain values, without zod: limits, an empty parts row and held fields put back as typed.
// fix-draft.ts re-exports them beside its schemas; the editor's first paint imports them from here.
import type { DraftPartRow } from './fix-draft';

export const fixDraftLimits = {
  title: 160,
  symptom: 200,
  symptoms: 20,
  errorCode: 40,
  errorCodes: 20,
  cause: 2000,
  parts: 100,
  readings: 50,
  cautions: 6,
  editSummary: 300,
  machines: 50,
  chassis: 20,
  photos: 30,
} as const;

export function emptyPartRow(): DraftPartRow {
  return { ref: '', kind: 'capacitor', value: '', rating: '', quantity: 1, notes: '' };
}

/** A field of a draft that failed its check: kept as the writer typed it, with what to change. */
export interface HeldField {
  typed: unknown;
  message: string;
}
/** Held fields by dotted path, e.g. "timeMinutes" or "parts.2.quantity". */
export type HeldFields = Record<string, HeldField>;

export type Path = (string | number)[];

export function isRecord(value: unknown): value is Record<string | number, unknown> {
  return typeof value === 'object' && value !== null;
}

export function getAt(root: unknown, path: Path): unknown {
  return path.reduce<unknown>((node, key) => (isRecord(node) ? node[key] : undefined), root);
}

export function setAt(root: unknown, path: Path, value: unknown): void {
  const parent = getAt(root, path.slice(0, -1));
  if (isRecord(parent)) parent[path[path.length - 1]!] = value;
}

/** The values with every held field put back as it was typed, for the form to show. Pure. */
export function withHeldFields<T extends object>(values: T, held: HeldFields | undefined): T {
  const out = structuredClone(values);
  for (const [key, field] of Object.entries(held ?? {})) {
    const path: Path = key.split('.').map((part) => (/^\d+$/.test(part) ? Number(part) : part));
    if (path.length === 1 || getAt(out, path.slice(0, -1)) !== undefined) setAt(out, path, field.typed);
  }
  return out;
}
