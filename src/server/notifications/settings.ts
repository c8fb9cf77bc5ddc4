// How each kind of news reaches a member: at once by e-mail, in the weekly digest, or only in the app.
import type { Knex } from 'knex';
import { db } from '../core/db';
import { effectiveDeliveries, notificationKinds, type Delivery, type NotificationKind } from '@/lib/notifications/kinds';

export async function deliveriesFor(userId: number, knex: Knex = db()): Promise<Record<NotificationKind, Delivery>> {
  const rows = await knex('notification_settings')
    .where({ user_id: userId })
    .select<{ kind: NotificationKind; delivery: Delivery }[]>('kind', 'delivery');
  return effectiveDeliveries(Object.fromEntries(rows.map((r) => [r.kind, r.delivery])));
}

/** Members (of those given) who want this kind at once by e-mail. */
export async function wantingNow(userIds: number[], kind: NotificationKind, knex: Knex = db()): Promise<Set<number>> {
  if (userIds.length === 0) return new Set();
  const chosen = await knex('notification_settings')
    .whereIn('user_id', userIds)
    .where({ kind })
    .select<{ user_id: number; delivery: Delivery }[]>('user_id', 'delivery');
  const byUser = new Map(chosen.map((r) => [r.user_id, r.delivery]));
  const fallback = effectiveDeliveries({})[kind];
  return new Set(userIds.filter((id) => (byUser.get(id) ?? fallback) === 'now'));
}

export async function saveDeliveries(
  userId: number,
  choices: Partial<Record<NotificationKind, Delivery>>,
  knex: Knex = db(),
): Promise<void> {
  const rows = notificationKinds.filter((kind) => choices[kind]).map((kind) => ({ user_id: userId, kind, delivery: choices[kind] }));
  if (rows.length === 0) return;
  await knex('notification_settings').insert(rows).onConflict(['user_id', 'kind']).merge(['delivery']);
}

/** One-click unsubscribe from a kind's mail: it stays in the app list. */
export async function stopMailFor(userId: number, kinds: readonly NotificationKind[], knex: Knex = db()): Promise<void> {
  await saveDeliveries(userId, Object.fromEntries(kinds.map((k) => [k, 'app' as Delivery])), knex);
}
