// `npm run bench -- --only news`: one proofing fanned out to 10,000 followers, and 10,000 weekly digests rendered.
// Prints the time to enqueue (what the moderator's request waits for), to fan out in batches, and to render.
import { performance } from 'node:perf_hooks';
import { migrateAndSeed, useOwnDatabase } from '../lib/prepare.ts';

const FOLLOWERS = Number(process.env.BENCH_FOLLOWERS ?? 10_000);

const env = await useOwnDatabase('benchlore_bench_news', {
  AUTH_SECRET: process.env.AUTH_SECRET ?? 'bench-secret-not-for-production-0123456789',
});
migrateAndSeed(env);
const { db, closeDb } = await import('../../src/server/core/db.ts');
const { queueProofedNews, fanOutProofed, FAN_OUT_BATCH } = await import('../../src/server/notifications/news.ts');
const { sendWeeklyDigests } = await import('../../src/server/notifications/digest.ts');
const knex = db();
try {
  const fix = await knex('fixes')
    .whereNotNull('current_revision_id')
    .whereNull('hidden_at')
    .orderBy('id')
    .first('id', 'current_revision_id');
  const ids: number[] = (
    await knex.raw(
      `INSERT INTO users (name, email, role, "emailVerified") SELECT 'Follower ' || g, 'follower-' || g || '@bench.example.test', 'member', now()
         FROM generate_series(1, ?) g RETURNING id`,
      [FOLLOWERS],
    )
  ).rows.map((r: { id: number }) => r.id);
  // In-app only for the fan-out (mail sending is the outbox's work, timed elsewhere); the digest for the render.
  await knex.raw(`INSERT INTO notification_settings (user_id, kind, delivery) SELECT id, 'fix_proofed', 'app' FROM unnest(?::int[]) id`, [
    ids,
  ]);
  await knex.raw(`INSERT INTO follows (user_id, target_kind, target_id) SELECT id, 'fix', ? FROM unnest(?::int[]) id`, [fix.id, ids]);

  let started = performance.now();
  await knex.transaction((trx) => queueProofedNews(trx, fix.current_revision_id));
  const enqueueMs = performance.now() - started;

  started = performance.now();
  const figures = await fanOutProofed(fix.current_revision_id, { knex });
  const fanOutMs = performance.now() - started;

  await knex('notification_settings').whereIn('user_id', ids).update({ delivery: 'digest' });
  let rendered = 0;
  let bytes = 0;
  started = performance.now();
  const digests = await sendWeeklyDigests(new Date(), {
    knex,
    userIds: ids,
    send: (mail) => {
      rendered++;
      bytes += mail.html.length + mail.text.length;
    },
  });
  const renderMs = performance.now() - started;

  const rows = [
    ['step', 'count', 'time', 'per item'],
    ['enqueue the fan-out (inside the proofing)', '1 job', `${enqueueMs.toFixed(1)} ms`, ''],
    [
      `fan-out in batches of ${FAN_OUT_BATCH}`,
      `${figures.recorded} events, ${figures.batches} batches`,
      `${(fanOutMs / 1000).toFixed(2)} s`,
      `${((fanOutMs / figures.recorded) * 1000).toFixed(0)} µs`,
    ],
    [
      'weekly digests built and rendered',
      `${digests.members} mails`,
      `${(renderMs / 1000).toFixed(2)} s`,
      `${(renderMs / Math.max(rendered, 1)).toFixed(2)} ms (${(bytes / Math.max(rendered, 1) / 1024).toFixed(1)} KB each)`,
    ],
  ];
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((r) => r[c]!.length)));
  console.log(`Notifications: one proofing to ${FOLLOWERS.toLocaleString('en')} followers, then their digests`);
  for (const row of rows) console.log(`  ${row.map((cell, c) => cell.padEnd(widths[c]!)).join('  ')}`);
  console.log('  goal: the proofing request waits only for the enqueue; fan-out and digests run in the job queue');
} finally {
  await closeDb();
}
