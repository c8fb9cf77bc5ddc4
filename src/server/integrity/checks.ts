// Integrity checks over the database and the photo store, for `npm run db:check` and after a crash: each check
// is one query that should find nothing, and says in a sentence what it found.
import type { Knex } from 'knex';

export interface IntegrityCheck {
  name: string;
  /** What a row it finds means, in words; the row's id follows. */
  problem: string;
  query: (knex: Knex) => Knex.QueryBuilder | Knex.Raw;
}

export const databaseChecks: IntegrityCheck[] = [
  {
    name: 'live revision not proofed',
    problem: 'fix whose live revision is not a proofed revision of that fix',
    query: (k) =>
      k('fixes as f')
        .join('revisions as r', 'r.id', 'f.current_revision_id')
        .where((w) => w.whereNot('r.state', 'proofed').orWhereRaw('r.fix_id <> f.id'))
        .select('f.slug as id'),
  },
  {
    name: 'fix without revisions',
    problem: 'fix with no revision at all (left half-made)',
    query: (k) =>
      k('fixes as f').whereNull('f.deleted_at').whereNotExists(k('revisions as r').whereRaw('r.fix_id = f.id')).select('f.slug as id'),
  },
  {
    name: 'submitted revision without time',
    problem: 'revision past draft without the time it was submitted',
    query: (k) => k('revisions').whereIn('state', ['submitted', 'proofed', 'returned']).whereNull('submitted_at').select('id'),
  },
  {
    name: 'live fix missing from search',
    problem: 'live fix whose search row is missing or names an older revision',
    query: (k) =>
      k('fixes as f')
        .leftJoin('fix_search as s', 's.fix_id', 'f.id')
        .whereNotNull('f.current_revision_id')
        .whereNull('f.deleted_at')
        .where((w) => w.whereNull('s.fix_id').orWhereRaw('s.revision_id <> f.current_revision_id'))
        .select('f.slug as id'),
  },
  {
    name: 'machines out of step',
    problem: "fix whose machines differ from its live revision's",
    query: (k) =>
      k.raw(`
        SELECT f.slug AS id FROM fixes f
        WHERE f.current_revision_id IS NOT NULL AND EXISTS (
          (SELECT machine_id FROM fix_machines WHERE fix_id = f.id
           EXCEPT SELECT machine_id FROM revision_machines WHERE revision_id = f.current_revision_id)
          UNION ALL
          (SELECT machine_id FROM revision_machines WHERE revision_id = f.current_revision_id
           EXCEPT SELECT machine_id FROM fix_machines WHERE fix_id = f.id))`),
  },
  {
    name: 'pending photo without upload',
    problem: 'photo waiting for renditions whose uploaded bytes are gone',
    query: (k) =>
      k('photos as p')
        .where('p.processing_state', 'pending')
        .whereNull('p.deleted_at')
        .whereNotExists(k('photo_uploads as u').whereRaw('u.photo_id = p.id'))
        .select('p.id'),
  },
];

/** Runs every database check; an empty list means all hold. */
export async function checkDatabase(knex: Knex): Promise<{ check: string; problem: string; ids: string[] }[]> {
  const found = [];
  for (const check of databaseChecks) {
    const result = await check.query(knex);
    const rows = (Array.isArray(result) ? result : (result as { rows: unknown[] }).rows) as { id: string | number }[];
    if (rows.length) found.push({ check: check.name, problem: check.problem, ids: rows.map((r) => String(r.id)) });
  }
  return found;
}
