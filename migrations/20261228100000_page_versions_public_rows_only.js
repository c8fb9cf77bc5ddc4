// The page counters are raised only by changes a public page can show. Before, every statement on the revision link
// tables, fixes and photos raised them, so each draft autosave (it rewrites its revision's machines, chassis and
// photos) changed the key of every public page, and a hundred writers saving at once queued on the counter's row.
// Drafts are never shown; a fix with no live revision is not shown; a photo is shown only through a revision past
// draft. Each trigger now looks at the rows its statement touched (transition tables, one check per statement, so
// a bulk load still costs one check) and raises the counter only when one of them can be seen.
const linkTables = ['revision_machines', 'revision_chassis', 'revision_photos'];
const events = ['INSERT', 'UPDATE', 'DELETE'];

/** @param {import('knex').Knex} knex */
async function dropStatementTriggers(knex, table) {
  await knex.raw(`DROP TRIGGER ${table}_page_version ON ${table}`);
}

/**
 * One trigger per event (a trigger with transition tables may name only one), and TRUNCATE, which always counts.
 * @param {import('knex').Knex} knex
 */
async function createFilteredTriggers(knex, table, fn, scope) {
  for (const event of events) {
    const transitions =
      event === 'INSERT'
        ? 'NEW TABLE AS new_rows'
        : event === 'DELETE'
          ? 'OLD TABLE AS old_rows'
          : 'OLD TABLE AS old_rows NEW TABLE AS new_rows';
    await knex.raw(
      `CREATE TRIGGER ${table}_page_version_${event.toLowerCase()} AFTER ${event} ON ${table}
         REFERENCING ${transitions} FOR EACH STATEMENT EXECUTE FUNCTION ${fn}('${scope}')`,
    );
  }
  await knex.raw(
    `CREATE TRIGGER ${table}_page_version_truncate AFTER TRUNCATE ON ${table}
       FOR EACH STATEMENT EXECUTE FUNCTION bump_page_version('${scope}')`,
  );
}

/** @param {import('knex').Knex} knex */
async function dropFilteredTriggers(knex, table) {
  for (const event of [...events, 'TRUNCATE']) await knex.raw(`DROP TRIGGER ${table}_page_version_${event.toLowerCase()} ON ${table}`);
}

/**
 * A trigger function raising the counter named by its argument when `shown` finds a row a public page can show among
 * the rows the statement added or changed (new_rows) or removed or changed (old_rows). Each transition table is read
 * only inside an IF on the events that have it: PL/pgSQL plans each statement when it first runs, so a branch never
 * reached is never planned (one condition naming both tables would fail on INSERT and on DELETE).
 * @param {string} name
 * @param {(rows: string) => string} shown
 */
function bumpWhenShown(name, shown) {
  return `
    CREATE FUNCTION ${name}() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP IN ('INSERT', 'UPDATE') THEN
        IF EXISTS (${shown('new_rows')}) THEN
          UPDATE page_versions SET version = version + 1 WHERE scope = TG_ARGV[0];
          RETURN NULL;
        END IF;
      END IF;
      IF TG_OP IN ('DELETE', 'UPDATE') THEN
        IF EXISTS (${shown('old_rows')}) THEN
          UPDATE page_versions SET version = version + 1 WHERE scope = TG_ARGV[0];
        END IF;
      END IF;
      RETURN NULL;
    END $$`;
}

/** @param {import('knex').Knex} knex */
export async function up(knex) {
  // A link row counts unless its revision is a draft. A row whose revision is already gone (deleted with it) counts:
  // such deletions are rare, and guessing wrong there would keep a stale page.
  await knex.raw(
    bumpWhenShown(
      'bump_page_version_for_shown_revisions',
      (rows) => `SELECT 1 FROM ${rows} x LEFT JOIN revisions r ON r.id = x.revision_id WHERE r.state IS DISTINCT FROM 'draft'`,
    ),
  );
  // A fix is shown once it has a live revision (and until it is deleted: the old row had one).
  await knex.raw(
    bumpWhenShown('bump_page_version_for_shown_fixes', (rows) => `SELECT 1 FROM ${rows} WHERE current_revision_id IS NOT NULL`),
  );
  // A photo is shown through a revision past draft. Removing a photo always counts (its links may already be gone).
  await knex.raw(`
    CREATE FUNCTION bump_page_version_for_shown_photos() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'DELETE' THEN
        UPDATE page_versions SET version = version + 1 WHERE scope = TG_ARGV[0];
      ELSIF EXISTS (
        SELECT 1 FROM new_rows n JOIN revision_photos rp ON rp.photo_id = n.id JOIN revisions r ON r.id = rp.revision_id
         WHERE r.state <> 'draft'
      ) THEN
        UPDATE page_versions SET version = version + 1 WHERE scope = TG_ARGV[0];
      END IF;
      RETURN NULL;
    END $$`);
  for (const table of linkTables) {
    await dropStatementTriggers(knex, table);
    await createFilteredTriggers(knex, table, 'bump_page_version_for_shown_revisions', 'fixes');
  }
  await dropStatementTriggers(knex, 'fixes');
  await createFilteredTriggers(knex, 'fixes', 'bump_page_version_for_shown_fixes', 'fixes');
  await dropStatementTriggers(knex, 'photos');
  await createFilteredTriggers(knex, 'photos', 'bump_page_version_for_shown_photos', 'photos');
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  for (const [table, scope] of [...linkTables.map((t) => [t, 'fixes']), ['fixes', 'fixes'], ['photos', 'photos']]) {
    await dropFilteredTriggers(knex, table);
    await knex.raw(
      `CREATE TRIGGER ${table}_page_version AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON ${table}
         FOR EACH STATEMENT EXECUTE FUNCTION bump_page_version('${scope}')`,
    );
  }
  await knex.raw('DROP FUNCTION bump_page_version_for_shown_photos()');
  await knex.raw('DROP FUNCTION bump_page_version_for_shown_fixes()');
  await knex.raw('DROP FUNCTION bump_page_version_for_shown_revisions()');
}
