// Makes a proofed revision the live text of its fix: current revision, what it applies to, its search row.
import type { Knex } from 'knex';
import slugify from '@sindresorhus/slugify';
import { refreshFixSearchRow } from '../search/fix-search-row';

const slugPattern = /^[a-z0-9]+(-[a-z0-9]+)*$/;

/** A slug from a title: lower-case words joined by dashes, cut at a word boundary, "fix" when nothing is left. */
export function slugFromTitle(title: string): string {
  const full = slugify(title, { lowercase: true, decamelize: false });
  let cut = full.length <= 80 ? full : full.slice(0, 80).replace(/-[^-]*$/, '');
  cut = cut.replace(/^-+|-+$/g, '');
  return slugPattern.test(cut) ? cut : 'fix';
}

/** The first free slug of the form base, base-2, base-3 … (ignoring the fix's own row). */
async function freeSlug(trx: Knex.Transaction, base: string, fixId: number): Promise<string> {
  const taken = new Set<string>(
    (await trx('fixes')
      .whereNot({ id: fixId })
      .where((q) => q.where('slug', base).orWhere('slug', 'like', `${base}-%`))
      .pluck('slug')) as string[],
  );
  if (!taken.has(base)) return base;
  for (let n = 2; ; n++) if (!taken.has(`${base}-${n}`)) return `${base}-${n}`;
}

/** Call inside the proofing transaction, after the revision is marked proofed. */
export async function publishRevision(trx: Knex.Transaction, fixId: number, revisionId: number): Promise<{ slug: string }> {
  const fix = await trx('fixes').where({ id: fixId }).first('slug', 'current_revision_id');
  let slug: string = fix.slug;
  // A new fix gets its public address from the title it goes live with.
  if (fix.current_revision_id === null) {
    const rev = await trx('revisions').where({ id: revisionId }).first('title');
    slug = await freeSlug(trx, slugFromTitle(rev.title), fixId);
  }
  await trx('fixes').where({ id: fixId }).update({ current_revision_id: revisionId, slug });
  await trx('fix_machines').where({ fix_id: fixId }).delete();
  await trx('fix_chassis').where({ fix_id: fixId }).delete();
  await trx.raw('INSERT INTO fix_machines (fix_id, machine_id) SELECT ?, machine_id FROM revision_machines WHERE revision_id = ?', [
    fixId,
    revisionId,
  ]);
  await trx.raw(
    'INSERT INTO fix_chassis (fix_id, chassis_family_id) SELECT ?, chassis_family_id FROM revision_chassis WHERE revision_id = ?',
    [fixId, revisionId],
  );
  await refreshFixSearchRow(trx, fixId);
  return { slug };
}
