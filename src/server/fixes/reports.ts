// Reports on fixes (wrong, dangerous, spam, duplicate): members file them, moderators resolve or dismiss them.
import { reportReasons } from '@/lib/schemas/fix-report';
import type { ReportInput } from '@/lib/schemas/fix-report-input';
import type { Resolution } from '@/lib/schemas/report-resolution';
import { can } from '@/lib/permissions';
import { db } from '../core/db';
import { writeAudit } from '../proofing/audit';
import { refuse, succeed, type Outcome, type Writer } from '../http/result';

/** Files a report on a live fix; a second open report for the same reason by the same member is refused. */
export async function createReport(reporter: Writer, fixSlug: string, input: ReportInput): Promise<Outcome<{ id: number }>> {
  if (!can(reporter, 'report_fix')) return refuse('forbidden', 'Confirm your e-mail address to report a fix.');
  const knex = db();
  const fix = await knex('fixes')
    .where({ slug: fixSlug })
    .whereNull('deleted_at')
    .whereNull('hidden_at')
    .whereNotNull('current_revision_id')
    .first('id');
  if (!fix) return refuse('not_found', 'There is no such fix.');
  try {
    return await knex.transaction(async (trx) => {
      const [row] = await trx('reports')
        .insert({ fix_id: fix.id, reporter_id: reporter.id, reason: input.reason, detail: input.detail })
        .returning('id');
      await writeAudit(trx, {
        actorId: reporter.id,
        action: 'report.create',
        subjectType: 'report',
        subjectId: row.id,
        detail: { fixId: fix.id, reason: input.reason },
      });
      return succeed({ id: row.id as number });
    });
  } catch (error) {
    const e = error as { code?: string; constraint?: string };
    if (e.code === '23505' && e.constraint === 'reports_one_open_idx') {
      return refuse('conflict', 'You have already reported this fix for this reason; a moderator will look at it.');
    }
    throw error;
  }
}

export interface OpenReport {
  id: number;
  fixSlug: string;
  fixTitle: string;
  reason: (typeof reportReasons)[number];
  detail: string;
  reporterName: string;
  createdAt: Date;
  fixLocked: boolean;
  fixHidden: boolean;
}

export async function listOpenReports(): Promise<OpenReport[]> {
  const rows = await db()('reports as rp')
    .join('fixes as f', 'f.id', 'rp.fix_id')
    .leftJoin('revisions as r', 'r.id', 'f.current_revision_id')
    .join('users as u', 'u.id', 'rp.reporter_id')
    .where('rp.state', 'open')
    // A deleted fix leaves nothing for a moderator to act on: its reports leave the desk with it.
    .whereNull('f.deleted_at')
    .orderBy('rp.created_at', 'asc')
    .limit(500)
    .select('rp.id', 'f.slug', 'r.title', 'rp.reason', 'rp.detail', 'u.name', 'rp.created_at', 'f.locked_at', 'f.hidden_at');
  return rows.map((r) => ({
    id: r.id,
    fixSlug: r.slug,
    fixTitle: r.title ?? r.slug,
    reason: r.reason,
    detail: r.detail,
    reporterName: r.name ?? 'a member',
    createdAt: r.created_at,
    fixLocked: r.locked_at !== null,
    fixHidden: r.hidden_at !== null,
  }));
}

/** A moderator closes a report: resolved (acted on) or dismissed (nothing to do). */
export async function closeReport(moderator: Writer, reportId: number, input: Resolution): Promise<Outcome<null>> {
  if (!can(moderator, 'moderate')) return refuse('forbidden', 'Only moderators handle reports.');
  return db().transaction(async (trx) => {
    const report = await trx('reports').where({ id: reportId }).forUpdate().first('state');
    if (!report) return refuse('not_found', 'There is no such report.');
    if (report.state !== 'open') return refuse('conflict', `This report is already ${report.state}.`);
    await trx('reports')
      .where({ id: reportId })
      .update({ state: input.outcome, resolved_by: moderator.id, resolved_at: trx.fn.now(), resolution_note: input.note || null });
    await writeAudit(trx, {
      actorId: moderator.id,
      action: input.outcome === 'resolved' ? 'report.resolve' : 'report.dismiss',
      subjectType: 'report',
      subjectId: reportId,
      detail: { note: input.note },
    });
    return succeed(null);
  });
}
