// One audit_log row per moderator action and per change of state in writing and proofing.
import type { Knex } from 'knex';

export type AuditAction =
  | 'revision.submit'
  | 'revision.withdraw'
  | 'revision.proof'
  | 'revision.return'
  | 'revision.amend'
  | 'report.create'
  | 'report.resolve'
  | 'report.dismiss'
  | 'fix.lock'
  | 'fix.unlock'
  | 'fix.hide'
  | 'fix.unhide';

export async function writeAudit(
  knex: Knex,
  entry: {
    actorId: number;
    action: AuditAction;
    subjectType: 'revision' | 'report' | 'fix';
    subjectId: number;
    detail?: Record<string, unknown>;
  },
): Promise<void> {
  await knex('audit_log').insert({
    actor_id: entry.actorId,
    action: entry.action,
    subject_type: entry.subjectType,
    subject_id: String(entry.subjectId),
    detail: JSON.stringify(entry.detail ?? {}),
  });
}
