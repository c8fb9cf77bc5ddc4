// The demo world's live fixes, for browser tests that need a real fix to open. They are written by the demo world's
// own people, so never one that another test file makes, hides or takes down while this one runs.
import type { Knex } from 'knex';
import { demoUsers } from '@/server/seed/demo/users';

/** Live, visible fixes of the demo world, joined to their live revision (`r`) and machines (`m`) to narrow and order. */
export function demoWorldFixes(knex: Knex): Knex.QueryBuilder {
  return knex('fixes as f')
    .join('revisions as r', 'r.id', 'f.current_revision_id')
    .join('fix_machines as fm', 'fm.fix_id', 'f.id')
    .join('machines as m', 'm.id', 'fm.machine_id')
    .whereNull('f.hidden_at')
    .whereNull('f.deleted_at')
    .whereIn(
      'f.created_by',
      knex('users')
        .select('id')
        .whereIn(
          'email',
          demoUsers.map((u) => u.email),
        ),
    );
}
