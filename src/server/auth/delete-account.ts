// Deleting an account anonymises it: contributions stay, credited to "a former member"; private records go.
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { db } from '../core/db';
import { writeAudit } from '../core/audit';

export const FORMER_MEMBER_NAME = 'a former member';

/** A unique address that can never receive mail (RFC 2606 reserves .invalid). */
export function tombstoneEmail(userId: number): string {
  return `deleted-${userId}-${randomBytes(6).toString('hex')}@deleted.invalid`;
}

export async function anonymiseAccount(userId: number, actorId: number | null, knex: Knex = db()): Promise<boolean> {
  return knex.transaction(async (trx) => {
    const before = await trx('users')
      .where({ id: userId })
      .whereNull('deleted_at')
      .forUpdate()
      .first<{ email: string } | undefined>('email');
    if (!before) return false;
    // Unused sign-in links for the old address.
    await trx('verification_token').where({ identifier: before.email }).delete();
    // What they followed and the news kept for them are theirs alone: gone with the account.
    for (const table of ['follows', 'notification_events', 'notification_settings', 'notification_digests'])
      await trx(table).where({ user_id: userId }).delete();
    const updated = await trx('users')
      .where({ id: userId })
      .whereNull('deleted_at')
      .update({
        name: FORMER_MEMBER_NAME,
        email: tombstoneEmail(userId),
        emailVerified: null,
        image: null,
        shop_name: null,
        password_hash: null,
        role: 'member',
        suspended_at: null,
        suspended_reason: null,
        deleted_at: trx.fn.now(),
        sessions_valid_after: new Date(),
      });
    if (updated === 0) return false;
    // The row stays (fixes, revisions and bench reports point at it), so cascades do not fire: remove private records here.
    const jobSheets = await trx('job_sheets').where({ owner_id: userId }).delete();
    const orderLists = await trx('order_lists').where({ owner_id: userId }).delete();
    await trx('user_tokens').where({ user_id: userId }).delete();
    await trx('sessions').where({ userId }).delete();
    await trx('accounts').where({ userId }).delete();
    await writeAudit({ actorId, action: 'user.delete', subjectType: 'user', subjectId: userId, detail: { jobSheets, orderLists } }, trx);
    return true;
  });
}
