// Moderators lock a fix against new revisions or hide it from readers (and search); every change is audited.
import { can } from '@/lib/permissions';
import type { FixFlag, FixFlagAction } from '@/lib/schemas/fix-flag';
import { db } from '../core/db';
import { writeAudit } from '../proofing/audit';
import { refuse, succeed, type Outcome, type Writer } from '../http/result';
import { refreshFixSearchRow } from '../search/fix-search-row';

const columns: Record<FixFlagAction, { at: string; by: string; set: boolean }> = {
  lock: { at: 'locked_at', by: 'locked_by', set: true },
  unlock: { at: 'locked_at', by: 'locked_by', set: false },
  hide: { at: 'hidden_at', by: 'hidden_by', set: true },
  unhide: { at: 'hidden_at', by: 'hidden_by', set: false },
};

export async function setFixFlag(moderator: Writer, fixSlug: string, input: FixFlag): Promise<Outcome<{ fixId: number }>> {
  const permission = input.action === 'lock' || input.action === 'unlock' ? 'lock_fix' : 'hide_fix';
  if (!can(moderator, permission)) return refuse('forbidden', 'Only moderators lock or hide fixes.');
  const column = columns[input.action];
  return db().transaction(async (trx) => {
    const fix = await trx('fixes').where({ slug: fixSlug }).whereNull('deleted_at').forUpdate().first('id', column.at);
    if (!fix) return refuse('not_found', 'There is no such fix.');
    if ((fix[column.at] !== null) === column.set)
      return refuse(
        'conflict',
        `This fix is already ${input.action === 'lock' ? 'locked' : input.action === 'unlock' ? 'unlocked' : input.action === 'hide' ? 'hidden' : 'shown'}.`,
      );
    await trx('fixes')
      .where({ id: fix.id })
      .update({ [column.at]: column.set ? trx.fn.now() : null, [column.by]: column.set ? moderator.id : null });
    // A hidden fix leaves search at once; shown again, it comes back.
    if (input.action === 'hide' || input.action === 'unhide') await refreshFixSearchRow(trx, fix.id);
    await writeAudit(trx, {
      actorId: moderator.id,
      action: `fix.${input.action}`,
      subjectType: 'fix',
      subjectId: fix.id,
      detail: { note: input.note },
    });
    return succeed({ fixId: fix.id as number });
  });
}

export interface FlaggedFix {
  slug: string;
  title: string;
  lockedAt: Date | null;
  hiddenAt: Date | null;
}

/** Fixes that are locked or hidden now, for the desk. */
export async function listFlaggedFixes(): Promise<FlaggedFix[]> {
  const rows = await db()('fixes as f')
    .leftJoin('revisions as r', 'r.id', 'f.current_revision_id')
    .whereNull('f.deleted_at')
    .where((q) => q.whereNotNull('f.locked_at').orWhereNotNull('f.hidden_at'))
    .orderBy('f.slug')
    .limit(500)
    .select('f.slug', 'r.title', 'f.locked_at', 'f.hidden_at');
  return rows.map((r) => ({ slug: r.slug, title: r.title ?? r.slug, lockedAt: r.locked_at, hiddenAt: r.hidden_at }));
}
