// What is news for a member: recorded once per cause (idempotent), listed in the app, counted as unread.
import type { Knex } from 'knex';
import { db } from '../core/db';
import type { NotificationKind } from '@/lib/notifications/kinds';

export interface NewEvent {
  userId: number;
  kind: NotificationKind;
  /** What caused it; recording the same cause for the same member twice keeps one row. */
  causeKey: string;
  fixId: number | null;
  title: string;
  line: string;
  path: string;
}

export interface RecordedEvent extends NewEvent {
  id: number;
}

/**
 * Records events; returns only those that are new (a repeat of a cause is silently kept once). A member whose account
 * is gone gets none: each member's row is read with a share lock, so an account being deleted at that moment is
 * waited for and then skipped (the deletion removes their news; a row written just after it would outlive it).
 */
export async function recordEvents(knex: Knex, events: NewEvent[]): Promise<RecordedEvent[]> {
  if (events.length === 0) return [];
  const rows = events.map((e) => ({
    user_id: e.userId,
    kind: e.kind,
    cause_key: e.causeKey,
    fix_id: e.fixId,
    title: e.title.slice(0, 300),
    line: e.line.slice(0, 500),
    path: e.path,
  }));
  const inserted = await knex.raw<{ rows: { id: string | number; user_id: number; cause_key: string }[] }>(
    `INSERT INTO notification_events (user_id, kind, cause_key, fix_id, title, line, path)
     SELECT e.user_id, e.kind, e.cause_key, e.fix_id, e.title, e.line, e.path
       FROM json_to_recordset(CAST(? AS json))
            AS e (user_id int, kind text, cause_key text, fix_id int, title text, line text, path text)
       JOIN users u ON u.id = e.user_id
      WHERE u.deleted_at IS NULL
        FOR SHARE OF u
     ON CONFLICT (user_id, cause_key) DO NOTHING
     RETURNING id, user_id, cause_key`,
    [JSON.stringify(rows)],
  );
  const byKey = new Map(events.map((e) => [`${e.userId}\u0000${e.causeKey}`, e]));
  return inserted.rows.map((row) => ({
    ...byKey.get(`${row.user_id}\u0000${row.cause_key}`)!,
    id: Number(row.id),
  }));
}

export interface ListedEvent {
  id: number;
  kind: NotificationKind;
  title: string;
  line: string;
  path: string;
  createdAt: Date;
  read: boolean;
}

/** Events on fixes that readers can no longer see (hidden, deleted) are never shown. */
function visible(query: Knex.QueryBuilder): Knex.QueryBuilder {
  return query.where((q) =>
    q.whereNull('e.fix_id').orWhereExists(function () {
      this.select(1).from('fixes as f').whereRaw('f.id = e.fix_id').whereNull('f.hidden_at').whereNull('f.deleted_at');
    }),
  );
}

export async function listEvents(
  userId: number,
  options: { limit?: number; before?: number } = {},
  knex: Knex = db(),
): Promise<ListedEvent[]> {
  const query = visible(knex('notification_events as e').where('e.user_id', userId));
  if (options.before) query.where('e.id', '<', options.before);
  const rows = await query
    .orderBy('e.id', 'desc')
    .limit(options.limit ?? 50)
    .select<{ id: string; kind: NotificationKind; title: string; line: string; path: string; created_at: Date; read_at: Date | null }[]>(
      'e.id',
      'e.kind',
      'e.title',
      'e.line',
      'e.path',
      'e.created_at',
      'e.read_at',
    );
  return rows.map((r) => ({
    id: Number(r.id),
    kind: r.kind,
    title: r.title,
    line: r.line,
    path: r.path,
    createdAt: r.created_at,
    read: r.read_at !== null,
  }));
}

/** The header's count: one indexed query (a partial index holds only unread rows). */
export async function unreadCount(userId: number, knex: Knex = db()): Promise<number> {
  const row = await visible(knex('notification_events as e').where('e.user_id', userId).whereNull('e.read_at')).count<{ n: string }[]>({
    n: '*',
  });
  return Number(row[0]?.n ?? 0);
}

/** Marks the member's events read: the ones named, or all of them. */
export async function markRead(userId: number, ids: number[] | 'all', knex: Knex = db()): Promise<number> {
  const query = knex('notification_events').where('user_id', userId).whereNull('read_at');
  if (ids !== 'all') query.whereIn('id', ids);
  return query.update({ read_at: knex.fn.now() });
}
