// Row counts and content checksums of every table the app owns, to prove a restore holds what was backed up.
import type { Knex } from 'knex';

export interface TableChecksum {
  rows: number;
  md5: string;
}

/** Schemas PostgreSQL itself owns; everything else (public, the job queue's) belongs to the app. */
const systemSchemas = ['pg_catalog', 'information_schema', 'pg_toast'];

export async function appTables(knex: Knex | Knex.Transaction): Promise<string[]> {
  const rows: { schemaname: string; tablename: string }[] = await knex('pg_tables')
    .select('schemaname', 'tablename')
    .whereNotIn('schemaname', systemSchemas)
    .orderBy(['schemaname', 'tablename']);
  return rows.map((r) => `${r.schemaname}.${r.tablename}`);
}

/**
 * One checksum per table: md5 over the sorted md5s of each row's text form, so row order does not matter.
 * Runs with TimeZone UTC so timestamps print the same on both sides of a restore.
 */
export async function tableChecksums(knex: Knex | Knex.Transaction): Promise<Record<string, TableChecksum>> {
  await knex.raw(`SET LOCAL "TimeZone" = 'UTC'`).catch(() => knex.raw(`SET "TimeZone" = 'UTC'`));
  const out: Record<string, TableChecksum> = {};
  for (const table of await appTables(knex)) {
    const [schema = '', name = ''] = table.split('.');
    const res = await knex.raw(
      `SELECT count(*)::bigint AS rows, coalesce(md5(string_agg(md5(t::text), '' ORDER BY md5(t::text))), '') AS md5 FROM ??.?? t`,
      [schema, name],
    );
    const row = res.rows[0] as { rows: string; md5: string };
    out[table] = { rows: Number(row.rows), md5: row.md5 };
  }
  return out;
}

/** The tables whose counts or contents differ, each with a sentence a person can act on. */
export function compareChecksums(expected: Record<string, TableChecksum>, actual: Record<string, TableChecksum>): string[] {
  const problems: string[] = [];
  for (const [table, want] of Object.entries(expected)) {
    const got = actual[table];
    if (!got) problems.push(`${table} is missing after the restore.`);
    else if (got.rows !== want.rows) problems.push(`${table} has ${got.rows} rows; the backup had ${want.rows}.`);
    else if (got.md5 !== want.md5) problems.push(`${table} has the same number of rows but different contents.`);
  }
  for (const table of Object.keys(actual)) {
    if (!(table in expected)) problems.push(`${table} exists after the restore but was not in the backup.`);
  }
  return problems;
}
