// Members and roles for the admin page: search, role changes and suspensions, each written to the audit log.
import type { Knex } from 'knex';
import { can, type Role, type SessionUser } from '@/lib/permissions';
import { roleChangeSchema } from '@/lib/schemas/role-change';
import { suspendSchema } from '@/lib/schemas/suspend';
import { unsuspendSchema } from '@/lib/schemas/unsuspend';
import { db } from '../core/db';
import { writeAudit } from '../core/audit';
import { fieldErrors } from '../http/responses';
import { enqueueMail } from '../mail/outbox';
import { suspendedMail } from '../mail/templates';
import { siteUrl } from './sign-up';
import { invalid, redirectTo, refused, type FormOutcome } from './form-outcome';
import { endAllSessions, publicUserColumns, roleOf, type UserRow } from './users';

export const USERS_PER_PAGE = 50;

export type ListedUser = Omit<UserRow, 'password_hash' | 'sessions_valid_after'>;

/** Members matching a name, e-mail or shop name fragment, newest first; deleted accounts left out. */
export async function listUsers(
  query: string | undefined,
  page: number,
  knex: Knex = db(),
): Promise<{ users: ListedUser[]; total: number }> {
  const base = knex('users').whereNull('deleted_at');
  if (query) {
    const like = `%${query.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    base.where((w) => w.whereILike('name', like).orWhereILike('email', like).orWhereILike('shop_name', like));
  }
  const [countRow] = await base.clone().count<{ count: string }[]>({ count: '*' });
  const users = await base
    .clone()
    .select<ListedUser[]>(publicUserColumns)
    .orderBy('created_at', 'desc')
    .orderBy('id', 'desc')
    .limit(USERS_PER_PAGE)
    .offset((page - 1) * USERS_PER_PAGE);
  return { users, total: Number(countRow?.count ?? 0) };
}

/** Back to the list the form was on, with the search kept. */
function back(fields: Record<string, string>, notice: string): string {
  const params = new URLSearchParams({ notice });
  const query = fields.q?.trim();
  if (query) params.set('q', query.slice(0, 200));
  return `/admin/users?${params}`;
}

type Subject = { id: number; role: Role; email: string; name: string | null; suspended_at: Date | null; suspended_reason: string | null };

async function subjectFor(trx: Knex, userId: number): Promise<Subject | null> {
  const row = await trx('users')
    .where({ id: userId })
    .whereNull('deleted_at')
    .forUpdate()
    .first('id', 'role', 'email', 'name', 'suspended_at', 'suspended_reason');
  return row ? { ...row, role: roleOf(row) } : null;
}

async function changeRole(actor: SessionUser, fields: Record<string, string>): Promise<FormOutcome> {
  const parsed = roleChangeSchema.safeParse(fields);
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const { userId, role } = parsed.data;
  return db().transaction(async (trx) => {
    const subject = await subjectFor(trx, userId);
    if (!subject) return refused(404, 'That member was not found.');
    if (!can(actor, 'manage_users', { subject })) return refused(403, 'You cannot change this member’s role (nobody changes their own).');
    if (subject.role === role) return redirectTo(back(fields, 'unchanged'));
    await trx('users').where({ id: userId }).update({ role });
    await writeAudit(
      {
        actorId: actor.id,
        action: 'user.role_change',
        subjectType: 'user',
        subjectId: userId,
        detail: { before: { role: subject.role }, after: { role } },
      },
      trx,
    );
    return redirectTo(back(fields, 'role-changed'));
  });
}

async function suspend(actor: SessionUser, fields: Record<string, string>): Promise<FormOutcome> {
  const parsed = suspendSchema.safeParse(fields);
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const { userId, reason } = parsed.data;
  let told: Subject | null = null;
  const outcome = await db().transaction(async (trx) => {
    const subject = await subjectFor(trx, userId);
    if (!subject) return refused(404, 'That member was not found.');
    if (!can(actor, 'suspend_user', { subject })) return refused(403, 'You cannot suspend this account.');
    if (subject.suspended_at) return redirectTo(back(fields, 'unchanged'));
    told = subject;
    await trx('users').where({ id: userId }).update({ suspended_at: trx.fn.now(), suspended_reason: reason });
    // Ending the sessions too means a cookie kept from before cannot come back to life when it is lifted.
    await endAllSessions(userId, trx);
    await writeAudit(
      {
        actorId: actor.id,
        action: 'user.suspend',
        subjectType: 'user',
        subjectId: userId,
        detail: { before: { suspended: false }, after: { suspended: true, reason } },
      },
      trx,
    );
    return redirectTo(back(fields, 'suspended'));
  });
  // As the form promises: the member is told why, once the suspension is stored.
  if (told) {
    const member: Subject = told;
    await enqueueMail(suspendedMail(member.email, member.name, reason, siteUrl('/help/house-rules')));
  }
  return outcome;
}

async function unsuspend(actor: SessionUser, fields: Record<string, string>): Promise<FormOutcome> {
  const parsed = unsuspendSchema.safeParse(fields);
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const { userId } = parsed.data;
  return db().transaction(async (trx) => {
    const subject = await subjectFor(trx, userId);
    if (!subject) return refused(404, 'That member was not found.');
    if (!can(actor, 'suspend_user', { subject })) return refused(403, 'You cannot lift this suspension.');
    if (!subject.suspended_at) return redirectTo(back(fields, 'unchanged'));
    await trx('users').where({ id: userId }).update({ suspended_at: null, suspended_reason: null });
    await writeAudit(
      {
        actorId: actor.id,
        action: 'user.unsuspend',
        subjectType: 'user',
        subjectId: userId,
        detail: { before: { suspended: true, reason: subject.suspended_reason }, after: { suspended: false } },
      },
      trx,
    );
    return redirectTo(back(fields, 'unsuspended'));
  });
}

export async function handleAdminUserForm(actor: SessionUser, fields: Record<string, string>): Promise<FormOutcome> {
  switch (fields.intent) {
    case 'role':
      return changeRole(actor, fields);
    case 'suspend':
      return suspend(actor, fields);
    case 'unsuspend':
      return unsuspend(actor, fields);
    default:
      return invalid({ intent: ['Choose one of the forms on this page.'] }, 'This form was not recognised.');
  }
}
