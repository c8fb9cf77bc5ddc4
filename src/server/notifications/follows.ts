// Following a machine, chassis family, maker or fix, and the member's list of what they follow.
import type { Knex } from 'knex';
import { db } from '../core/db';
import { refuse, succeed, type Outcome } from '../http/result';
import { followTargetLabels, type FollowTargetKind } from '@/lib/notifications/kinds';

interface TargetTable {
  table: string;
  /** SQL for the name a reader knows it by, over the table aliased `t`. */
  name: string;
  path: (slug: string) => string;
  /** Rows that readers can no longer see. */
  gone: string;
}

const targets: Record<FollowTargetKind, TargetTable> = {
  machine: {
    table: 'machines',
    name: `(SELECT m.name FROM makers m WHERE m.id = t.maker_id) || ' ' || t.model_number`,
    path: (slug) => `/machines/${slug}`,
    gone: 't.deleted_at IS NOT NULL',
  },
  chassis: {
    table: 'chassis_families',
    name: `(SELECT m.name FROM makers m WHERE m.id = t.maker_id) || ' ' || t.name`,
    path: (slug) => `/chassis/${slug}`,
    gone: 't.deleted_at IS NOT NULL',
  },
  maker: { table: 'makers', name: 't.name', path: (slug) => `/makers/${slug}`, gone: 't.deleted_at IS NOT NULL' },
  fix: {
    table: 'fixes',
    name: `(SELECT r.title FROM revisions r WHERE r.id = t.current_revision_id)`,
    path: (slug) => `/fixes/${slug}`,
    gone: 't.deleted_at IS NOT NULL OR t.hidden_at IS NOT NULL OR t.current_revision_id IS NULL',
  },
};

export interface FollowTarget {
  kind: FollowTargetKind;
  id: number;
  slug: string;
  name: string;
  path: string;
}

/** The thing named by kind and slug, if readers can see it. */
export async function findFollowTarget(kind: FollowTargetKind, slug: string, knex: Knex = db()): Promise<FollowTarget | null> {
  const target = targets[kind];
  const row = await knex
    .select<{ id: number; slug: string; name: string | null }>('t.id', 't.slug', knex.raw(`${target.name} AS name`))
    .from({ t: target.table })
    .where('t.slug', slug)
    .whereRaw(`NOT (${target.gone})`)
    .first();
  if (!row) return null;
  return { kind, id: row.id, slug: row.slug, name: row.name ?? row.slug, path: target.path(row.slug) };
}

/** Starts or stops following; following twice or stopping twice is not an error. */
export async function setFollowing(
  userId: number,
  kind: FollowTargetKind,
  slug: string,
  follow: boolean,
): Promise<Outcome<{ target: FollowTarget; following: boolean }>> {
  const knex = db();
  const target = await findFollowTarget(kind, slug, knex);
  if (!target) return refuse('not_found', `There is no ${followTargetLabels[kind]} at that address to follow.`);
  if (follow) {
    await knex('follows')
      .insert({ user_id: userId, target_kind: kind, target_id: target.id })
      .onConflict(['user_id', 'target_kind', 'target_id'])
      .ignore();
  } else {
    await knex('follows').where({ user_id: userId, target_kind: kind, target_id: target.id }).delete();
  }
  return succeed({ target, following: follow });
}

export async function isFollowing(userId: number, kind: FollowTargetKind, targetId: number, knex: Knex = db()): Promise<boolean> {
  const row = await knex('follows').where({ user_id: userId, target_kind: kind, target_id: targetId }).first('id');
  return Boolean(row);
}

export interface FollowedItem extends FollowTarget {
  since: Date;
}

/** Everything the member follows, newest first; things since hidden or removed are left out. */
export async function listFollows(userId: number, knex: Knex = db()): Promise<FollowedItem[]> {
  const lists = await Promise.all(
    (Object.keys(targets) as FollowTargetKind[]).map(async (kind) => {
      const target = targets[kind];
      const rows = await knex
        .select<{ id: number; slug: string; name: string | null; since: Date }[]>(
          't.id',
          't.slug',
          knex.raw(`${target.name} AS name`),
          'f.created_at AS since',
        )
        .from({ f: 'follows' })
        .join({ t: target.table }, 't.id', 'f.target_id')
        .where({ 'f.user_id': userId, 'f.target_kind': kind })
        .whereRaw(`NOT (${target.gone})`);
      return rows.map((row) => ({
        kind,
        id: row.id,
        slug: row.slug,
        name: row.name ?? row.slug,
        path: target.path(row.slug),
        since: row.since,
      }));
    }),
  );
  return lists.flat().sort((a, b) => b.since.getTime() - a.since.getTime());
}

/** Stops one follow by its id (the unsubscribe link names it); true when it was there. */
export async function stopFollowById(userId: number, followId: number, knex: Knex = db()): Promise<boolean> {
  return (await knex('follows').where({ id: followId, user_id: userId }).delete()) > 0;
}

/** Whether the member follows the thing named by its address slug (false when there is no such thing). */
export async function isFollowingSlug(userId: number, kind: FollowTargetKind, slug: string, knex: Knex = db()): Promise<boolean> {
  const target = await findFollowTarget(kind, slug, knex);
  return target ? isFollowing(userId, kind, target.id, knex) : false;
}
