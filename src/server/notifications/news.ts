// Turning what happened into news for the members it concerns: a proofed revision for followers (fanned out
// by the job queue in batches, never inside the moderator's request), a bench report for the fix's authors,
// a revised fix for hand-over notes that cite it, a moderator's note for the author. Each is recorded once.
import type { Knex } from 'knex';
import { db } from '../core/db';
import { config, type Config } from '../core/config';
import { logger } from '../core/logger';
import { ensureQueue, sendJob, startQueueWorker, type QueueWorker, type RetryPolicy } from '../core/job-queue';
import { enqueueMail } from '../mail/outbox';
import { recordEvents, type NewEvent, type RecordedEvent } from './events';
import { wantingNow } from './settings';
import { eventMail } from './mails';
import { changedFieldsLine, type NotificationKind } from '@/lib/notifications/kinds';

/**
 * The fan-out queue. Like the mail outbox's, a server on a local mail sink has one of its own, so servers side by
 * side on one database (the tests') each fan out, and mail, their own proofings; with SMTP_URL all share one.
 */
export function proofedNewsQueue(settings: Pick<Config, 'SMTP_URL' | 'SMTP_SINK_PORT'> = config()): string {
  return settings.SMTP_URL ? 'news-proofed' : `news-proofed-sink-${settings.SMTP_SINK_PORT}`;
}
export const FAN_OUT_BATCH = 1000;
/** About a day of retries with back-off: a fan-out that meets an outage is done when the database is back. */
const newsRetry: RetryPolicy = { retryLimit: 12, retryDelay: 5, retryBackoff: true };

/** Called after a proofing commits (or inside its transaction: the job then appears only if it commits). */
export async function queueProofedNews(knex: Knex, revisionId: number): Promise<void> {
  await ensureQueue(proofedNewsQueue(), newsRetry);
  await sendJob(knex, proofedNewsQueue(), { revisionId }, { ...newsRetry, singletonKey: `proofed:${revisionId}` });
}

interface ProofedRevision {
  fixId: number;
  slug: string;
  number: number;
  title: string;
  authorId: number;
  baseRevisionId: number | null;
  changed: string[];
  hidden: boolean;
}

const comparedFields: [column: string, label: string][] = [
  ['title', 'title'],
  ['symptoms', 'symptoms'],
  ['error_codes', 'codes'],
  ['cause', 'cause'],
  ['body', 'remedy'],
  ['parts', 'parts'],
  ['readings', 'readings'],
  ['cautions', 'cautions'],
  ['difficulty', 'difficulty'],
  ['time_minutes', 'time'],
];

async function loadProofed(knex: Knex, revisionId: number): Promise<ProofedRevision | null> {
  const row = await knex('revisions as r')
    .join('fixes as f', 'f.id', 'r.fix_id')
    .leftJoin('revisions as b', 'b.id', 'r.parent_revision_id')
    .where('r.id', revisionId)
    .where('r.state', 'proofed')
    .first(
      'r.fix_id',
      'f.slug',
      'r.number',
      'r.title',
      'r.author_id',
      'b.id as base_id',
      knex.raw('(f.hidden_at IS NOT NULL OR f.deleted_at IS NOT NULL OR f.current_revision_id IS DISTINCT FROM r.id) AS hidden'),
      ...comparedFields.map(([column]) => knex.raw(`(b.id IS NOT NULL AND r.${column} IS DISTINCT FROM b.${column}) AS changed_${column}`)),
    );
  if (!row) return null;
  return {
    fixId: row.fix_id,
    slug: row.slug,
    number: row.number,
    title: row.title,
    authorId: row.author_id,
    baseRevisionId: row.base_id ?? null,
    changed: comparedFields.filter(([column]) => row[`changed_${column}`]).map(([, label]) => label),
    hidden: row.hidden === true,
  };
}

/**
 * Members following the fix, its machines, their chassis families or makers: one keyset page in user order, each with
 * the follow their mail should offer to stop (the most specific thing they follow: the fix, then a machine, a chassis
 * family, a maker).
 */
async function followersPage(
  knex: Knex,
  fixId: number,
  afterUserId: number,
  limit: number,
): Promise<{ userId: number; followId: number }[]> {
  const rows = await knex.raw<{ rows: { user_id: number; follow_id: number }[] }>(
    `WITH targets(kind, id) AS (
       SELECT 'fix', ?::int
       UNION SELECT 'machine', machine_id FROM fix_machines WHERE fix_id = ?
       UNION SELECT 'chassis', chassis_family_id FROM fix_chassis WHERE fix_id = ?
       UNION SELECT 'chassis', m.chassis_family_id FROM fix_machines fm JOIN machines m ON m.id = fm.machine_id
             WHERE fm.fix_id = ? AND m.chassis_family_id IS NOT NULL
       UNION SELECT 'maker', m.maker_id FROM fix_machines fm JOIN machines m ON m.id = fm.machine_id WHERE fm.fix_id = ?
       UNION SELECT 'maker', c.maker_id FROM fix_chassis fc JOIN chassis_families c ON c.id = fc.chassis_family_id WHERE fc.fix_id = ?
     )
     SELECT DISTINCT ON (f.user_id) f.user_id, f.id AS follow_id
       FROM follows f JOIN targets t ON t.kind = f.target_kind AND t.id = f.target_id
       JOIN users u ON u.id = f.user_id AND u.deleted_at IS NULL AND u.suspended_at IS NULL
      WHERE f.user_id > ?
      ORDER BY f.user_id, array_position(ARRAY['fix', 'machine', 'chassis', 'maker'], f.target_kind)
      LIMIT ?`,
    [fixId, fixId, fixId, fixId, fixId, fixId, afterUserId, limit],
  );
  return rows.rows.map((r) => ({ userId: r.user_id, followId: r.follow_id }));
}

/** Sends at once the events whose members chose "at once"; the rest wait for the digest or stay in the app. */
async function mailNow(knex: Knex, events: RecordedEvent[], kind: NotificationKind, stopFollowOf?: Map<number, number>): Promise<number> {
  const now = await wantingNow([...new Set(events.map((e) => e.userId))], kind, knex);
  const due = events.filter((e) => now.has(e.userId));
  if (due.length === 0) return 0;
  const recipients = new Map(
    (
      await knex('users')
        .whereIn(
          'id',
          due.map((e) => e.userId),
        )
        .whereNull('deleted_at')
        .whereNotNull('emailVerified')
        .select<{ id: number; email: string; name: string | null }[]>('id', 'email', 'name')
    ).map((u) => [u.id, { id: u.id, email: u.email, name: u.name ?? 'there' }]),
  );
  let sent = 0;
  for (const event of due) {
    const recipient = recipients.get(event.userId);
    if (!recipient) continue;
    const followId = stopFollowOf?.get(event.userId);
    const mail = await eventMail(recipient, event, followId ? { follow: followId } : { kind });
    await enqueueMail(mail, knex);
    await knex('notification_events').where({ id: event.id }).update({ mailed_at: knex.fn.now() });
    sent++;
  }
  return sent;
}

export interface FanOutFigures {
  recorded: number;
  batches: number;
  mailed: number;
}

/**
 * Records "a fix went live" for every follower, in batches of `batchSize` members, and the hand-over-note
 * news for members whose notes cite an earlier revision. Safe to run twice: causes are recorded once.
 */
export async function fanOutProofed(revisionId: number, options: { batchSize?: number; knex?: Knex } = {}): Promise<FanOutFigures> {
  const knex = options.knex ?? db();
  const batchSize = options.batchSize ?? FAN_OUT_BATCH;
  const revision = await loadProofed(knex, revisionId);
  const figures: FanOutFigures = { recorded: 0, batches: 0, mailed: 0 };
  // Hidden or withdrawn before the job ran: nobody hears about it.
  if (!revision || revision.hidden) return figures;
  const isNew = revision.baseRevisionId === null;
  const line = changedFieldsLine(revision.changed, isNew);
  const title = isNew ? revision.title : `${revision.title} (revision r${revision.number})`;
  const path = `/fixes/${revision.slug}`;
  let after = 0;
  for (;;) {
    const page = await followersPage(knex, revision.fixId, after, batchSize);
    if (page.length === 0) break;
    after = page[page.length - 1]!.userId;
    // The author hears from the proofing desk itself.
    const followers = page.filter((f) => f.userId !== revision.authorId);
    figures.batches++;
    const events: NewEvent[] = followers.map(({ userId }) => ({
      userId,
      kind: 'fix_proofed',
      causeKey: `proofed:r${revisionId}`,
      fixId: revision.fixId,
      title,
      line,
      path,
    }));
    const recorded = await recordEvents(knex, events);
    figures.recorded += recorded.length;
    if (recorded.length)
      figures.mailed += await mailNow(knex, recorded, 'fix_proofed', new Map(followers.map((f) => [f.userId, f.followId])));
    if (page.length < batchSize) break;
  }
  if (!isNew) {
    const notes = await knex('handover_notes')
      .where({ fix_id: revision.fixId })
      .whereNull('revoked_at')
      .whereNot('revision_id', revisionId)
      .select<{ id: number; member_id: number; code: string }[]>('id', 'member_id', 'code');
    const recorded = await recordEvents(
      knex,
      notes.map((note) => ({
        userId: note.member_id,
        kind: 'handover_revised',
        causeKey: `handover:${note.id}:r${revisionId}`,
        fixId: revision.fixId,
        title: `${revision.title}: revised after your hand-over note ${note.code}`,
        line: `${line} Your note still shows the revision the customer was given; decide whether to tell them.`,
        path: `/notes/${note.code}`,
      })),
    );
    figures.recorded += recorded.length;
    figures.mailed += await mailNow(knex, recorded, 'handover_revised');
  }
  return figures;
}

/** A bench report on someone else's fix: news for the fix's authors (its first writer and proofed revisions' authors). */
export async function recordBenchReportNews(reportId: number, knex: Knex = db()): Promise<number> {
  const report = await knex('bench_reports as b')
    .join('fixes as f', 'f.id', 'b.fix_id')
    .join('revisions as cur', 'cur.id', 'f.current_revision_id')
    .join('machines as m', 'm.id', 'b.machine_id')
    .where('b.id', reportId)
    .first<
      | {
          fix_id: number;
          slug: string;
          title: string;
          member_id: number;
          outcome: string;
          held_days: number | null;
          updated_at: Date;
          model_number: string;
        }
      | undefined
    >('b.fix_id', 'f.slug', 'cur.title', 'b.member_id', 'b.outcome', 'b.held_days', 'b.updated_at', 'm.model_number');
  if (!report) return 0;
  const authors = (
    await knex.raw<{ rows: { id: number }[] }>(
      `SELECT created_by AS id FROM fixes WHERE id = ? UNION SELECT author_id FROM revisions WHERE fix_id = ? AND state = 'proofed'`,
      [report.fix_id, report.fix_id],
    )
  ).rows
    .map((r) => r.id)
    .filter((id) => id !== report.member_id);
  const cameBack = report.outcome === 'came_back';
  const kind: NotificationKind = cameBack ? 'fault_came_back' : 'bench_report';
  const said: Record<string, string> = {
    fixed: 'it fixed the fault',
    partly: 'it partly fixed the fault',
    not_fixed: 'it did not fix the fault',
    came_back: `the fault came back${report.held_days !== null ? ` after ${report.held_days} days` : ''}`,
  };
  const recorded = await recordEvents(
    knex,
    authors.map((userId) => ({
      userId,
      kind,
      // A changed report (say, fixed → came back) is news again; the same report saved twice is not.
      causeKey: `bench:${reportId}:${report.outcome}`,
      fixId: report.fix_id,
      title: report.title,
      line: `A bench report on a ${report.model_number}: ${said[report.outcome] ?? report.outcome}.`,
      path: `/fixes/${report.slug}#bench-reports`,
    })),
  );
  await mailNow(knex, recorded, kind);
  return recorded.length;
}

/** A moderator's note to the author on proofing or returning a revision: kept in the author's list. */
export async function recordModeratorReply(
  revision: { id: number; fixId: number; authorId: number; title: string; number: number },
  outcome: 'proofed' | 'returned',
  note: string,
  path: string,
  knex: Knex = db(),
): Promise<void> {
  if (!note) return;
  // The author already gets the proofing desk's own mail at once; this is the in-app copy.
  await recordEvents(knex, [
    {
      userId: revision.authorId,
      kind: 'moderator_reply',
      causeKey: `reply:r${revision.id}:${outcome}`,
      fixId: outcome === 'proofed' ? revision.fixId : null,
      title: `${revision.title} (r${revision.number}) ${outcome === 'proofed' ? 'proofed' : 'returned'} with a note`,
      line: note,
      path,
    },
  ]);
}

/** The fan-out worker, started at boot with the server's other background work. */
export async function startNewsWorker(): Promise<QueueWorker> {
  return startQueueWorker<{ revisionId: number }>(
    proofedNewsQueue(),
    newsRetry,
    async (jobs) => {
      for (const job of jobs) {
        const figures = await fanOutProofed(job.revisionId);
        logger().info({ revisionId: job.revisionId, ...figures }, 'proofed news fanned out');
      }
    },
    { batchSize: 5 },
  );
}
