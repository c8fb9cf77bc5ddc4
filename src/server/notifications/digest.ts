// The weekly digest: one mail per member per finished week, built from that week's events the member chose to
// hear about in the digest; none for a member with nothing new; never an event on a hidden or removed fix.
import type { Knex } from 'knex';
import { db } from '../core/db';
import { logger } from '../core/logger';
import type { OutgoingMail } from '../mail/send';
import { enqueueMail } from '../mail/outbox';
import { digestMail, type MailEvent } from './mails';
import { effectiveDeliveries, weekStart, type Delivery, type NotificationKind } from '@/lib/notifications/kinds';

interface DigestRow {
  user_id: number;
  kind: NotificationKind;
  title: string;
  line: string;
  path: string;
}

const DAY_MS = 86_400_000;

/** The week's events per member, on fixes readers can still see, for members still active. */
async function weekEvents(knex: Knex, start: Date, userIds?: number[]): Promise<Map<number, DigestRow[]>> {
  const end = new Date(start.getTime() + 7 * DAY_MS);
  const query = knex('notification_events as e')
    .join('users as u', 'u.id', 'e.user_id')
    .whereNull('u.deleted_at')
    .whereNull('u.suspended_at')
    .whereNotNull('u.emailVerified')
    .where('e.created_at', '>=', start)
    .where('e.created_at', '<', end)
    .whereNull('e.mailed_at')
    .where((q) =>
      q.whereNull('e.fix_id').orWhereExists(function () {
        this.select(1).from('fixes as f').whereRaw('f.id = e.fix_id').whereNull('f.hidden_at').whereNull('f.deleted_at');
      }),
    )
    .whereNotExists(function () {
      this.select(1).from('notification_digests as d').whereRaw('d.user_id = e.user_id').where('d.week_start', start);
    })
    .orderBy(['e.user_id', 'e.id'])
    .select<DigestRow[]>('e.user_id', 'e.kind', 'e.title', 'e.line', 'e.path');
  if (userIds) query.whereIn('e.user_id', userIds);
  const byUser = new Map<number, DigestRow[]>();
  for (const row of await query) {
    const list = byUser.get(row.user_id) ?? [];
    list.push(row);
    byUser.set(row.user_id, list);
  }
  return byUser;
}

async function deliveriesOf(knex: Knex, userIds: number[]): Promise<Map<number, Record<NotificationKind, Delivery>>> {
  const rows = userIds.length
    ? await knex('notification_settings')
        .whereIn('user_id', userIds)
        .select<{ user_id: number; kind: NotificationKind; delivery: Delivery }[]>('user_id', 'kind', 'delivery')
    : [];
  const chosen = new Map<number, Partial<Record<NotificationKind, Delivery>>>();
  for (const row of rows) chosen.set(row.user_id, { ...chosen.get(row.user_id), [row.kind]: row.delivery });
  return new Map(userIds.map((id) => [id, effectiveDeliveries(chosen.get(id) ?? {})]));
}

export interface DigestFigures {
  weekStart: string;
  members: number;
  events: number;
}

/**
 * Builds and sends the digests of the week that starts at `start` (a Monday, UTC). Each member's digest is
 * claimed with a row in notification_digests before it is sent, so running this twice sends nothing twice.
 * `send` is the mail outbox by default; the benchmark passes a counter to time rendering alone.
 */
export async function sendWeeklyDigests(
  start: Date,
  options: { knex?: Knex; send?: (mail: OutgoingMail) => Promise<unknown> | void; userIds?: number[] } = {},
): Promise<DigestFigures> {
  const knex = options.knex ?? db();
  const send = options.send ?? ((mail: OutgoingMail) => enqueueMail(mail, knex));
  const week = weekStart(start);
  const byUser = await weekEvents(knex, week, options.userIds);
  const deliveries = await deliveriesOf(knex, [...byUser.keys()]);
  const figures: DigestFigures = { weekStart: week.toISOString().slice(0, 10), members: 0, events: 0 };
  const recipients = new Map(
    (
      await knex('users')
        .whereIn('id', [...byUser.keys()])
        .select<{ id: number; email: string; name: string | null }[]>('id', 'email', 'name')
    ).map((u) => [u.id, u]),
  );
  const due = [...byUser]
    .map(([userId, rows]) => ({
      userId,
      user: recipients.get(userId),
      wanted: rows.filter((row) => deliveries.get(userId)?.[row.kind] === 'digest'),
    }))
    .filter((d) => d.wanted.length > 0 && d.user);
  // Claimed a thousand at a time, before sending: a second run (or another instance) finds them taken.
  for (let at = 0; at < due.length; at += 1000) {
    const chunk = due.slice(at, at + 1000);
    const claimed = new Set<number>(
      (
        await knex('notification_digests')
          .insert(chunk.map((d) => ({ user_id: d.userId, week_start: week, events: d.wanted.length })))
          .onConflict(['user_id', 'week_start'])
          .ignore()
          .returning('user_id')
      ).map((row: { user_id: number }) => row.user_id),
    );
    for (const { userId, user, wanted } of chunk) {
      if (!claimed.has(userId) || !user) continue;
      const events: MailEvent[] = wanted.map((row) => ({ kind: row.kind, title: row.title, line: row.line, path: row.path }));
      await send(await digestMail({ id: userId, email: user.email, name: user.name ?? 'there' }, events, week));
      figures.members++;
      figures.events += wanted.length;
    }
  }
  return figures;
}

/** Once an hour, sends last week's digests if they are not sent yet (idempotent, so any instance may run it). */
export function startDigestTimer(): { stop(): void } {
  const tick = (): void => {
    const lastWeek = new Date(weekStart(new Date()).getTime() - 7 * DAY_MS);
    sendWeeklyDigests(lastWeek)
      .then((figures) => figures.members && logger().info(figures, 'weekly digests sent'))
      .catch((error: unknown) => logger().error({ err: error }, 'weekly digests failed'));
  };
  const timer = setInterval(tick, 60 * 60_000);
  timer.unref();
  const first = setTimeout(tick, 30_000);
  first.unref();
  return {
    stop() {
      clearInterval(timer);
      clearTimeout(first);
    },
  };
}
