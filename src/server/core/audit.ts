// The audit log: one row per moderator, admin or account action, with what changed.
import type { Knex } from 'knex';
import { db } from './db';

export interface AuditEntry {
  actorId: number | null;
  /** Dotted verb, e.g. 'user.role_change', 'user.suspend', 'user.delete'. */
  action: string;
  subjectType: string;
  subjectId: string | number;
  detail: Record<string, unknown>;
}

export async function writeAudit(entry: AuditEntry, knex: Knex = db()): Promise<void> {
  await knex('audit_log').insert({
    actor_id: entry.actorId,
    action: entry.action,
    subject_type: entry.subjectType,
    subject_id: String(entry.subjectId),
    detail: JSON.stringify(entry.detail),
  });
}
