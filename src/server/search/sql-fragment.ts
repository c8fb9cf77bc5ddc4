// SQL pieces with their bindings kept beside them, so search queries are built from parts and never from values.
import type { Knex } from 'knex';

export interface Fragment {
  sql: string;
  bindings: Knex.RawBinding[];
}

export function frag(sql: string, ...bindings: Knex.RawBinding[]): Fragment {
  return { sql, bindings };
}

export function joinFragments(parts: Fragment[], separator: string): Fragment {
  return { sql: parts.map((p) => p.sql).join(separator), bindings: parts.flatMap((p) => p.bindings) };
}

/** AND of the parts; TRUE when there are none. */
export function allOf(parts: Fragment[]): Fragment {
  if (parts.length === 0) return frag('TRUE');
  const joined = joinFragments(
    parts.map((p) => frag(`(${p.sql})`, ...p.bindings)),
    ' AND ',
  );
  return joined;
}

/** OR of the parts; FALSE when there are none. */
export function anyOf(parts: Fragment[]): Fragment {
  if (parts.length === 0) return frag('FALSE');
  return joinFragments(
    parts.map((p) => frag(`(${p.sql})`, ...p.bindings)),
    ' OR ',
  );
}

export function raw(knex: Knex, fragment: Fragment): Knex.Raw {
  return knex.raw(fragment.sql, fragment.bindings);
}

/**
 * A PostgreSQL array literal ('{"a","b"}') for binding as ?::text[] or ?::int[]: Knex would spread a
 * JavaScript array into a list of separate bindings.
 */
export function pgArray(values: readonly (string | number)[]): string {
  const items = values.map((v) => (typeof v === 'number' ? String(v) : `"${v.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`));
  return `{${items.join(',')}}`;
}
