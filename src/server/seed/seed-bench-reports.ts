// Seeds bench reports from the demo technicians: deterministic, one per member per fix per machine.
import type { Knex } from 'knex';
import { seededRandom, pick } from './prng';
import { demoUsers } from './demo/users';
import { demoFixes } from './demo/fixes';
import type { SeededIds } from './seed-catalogue';

const notes: Record<string, string[]> = {
  fixed: [
    'Worked exactly as described.',
    'Took longer than stated, but the fault is gone.',
    'Fixed. Also cleaned the rest of the transport while in there.',
    '',
  ],
  partly: ['Better, but an intermittent fault remains.', 'Fault mostly cleared; a second part was also worn.'],
  not_fixed: ['Not the cause on this unit; the fault was elsewhere.', 'Same symptom, different cause here.'],
  came_back: ['Fault returned after a few weeks.', 'Held for a while, then the symptom came back.'],
};

export async function seedBenchReports(knex: Knex, ids: SeededIds): Promise<number> {
  const reporters = demoUsers.filter((u) => u.role !== 'admin').map((u) => ({ key: u.key, id: ids.users.get(u.key) }));
  // Only the demo fixes, in the demo world's own order, so a re-run draws the same reports whatever else exists.
  const order = new Map(demoFixes.map((f, i) => [f.slug, i]));
  const rows = await knex('fixes as f')
    .whereNull('f.deleted_at')
    .whereIn('f.slug', [...order.keys()])
    .select(
      'f.id',
      'f.slug',
      'f.created_by',
      'f.current_revision_id',
      knex.raw('ARRAY(SELECT id FROM revisions r WHERE r.fix_id = f.id AND r.state = ? ORDER BY number) AS revision_ids', ['proofed']),
    );
  const fixes = rows.sort((a, b) => (order.get(a.slug) ?? 0) - (order.get(b.slug) ?? 0));
  let inserted = 0;
  for (const fix of fixes) {
    const machineIds: number[] = (await knex('fix_machines').where({ fix_id: fix.id }).orderBy('machine_id').pluck('machine_id')).concat(
      await knex('fix_chassis as fc')
        .join('machines as m', 'm.chassis_family_id', 'fc.chassis_family_id')
        .where('fc.fix_id', fix.id)
        .orderBy('m.id')
        .pluck('m.id'),
    );
    if (machineIds.length === 0) continue;
    // Each fix draws from its own sequence, so its reports do not depend on what else is in the database.
    const random = seededRandom(seedOf(fix.slug));
    const count = 2 + Math.floor(random() * 4);
    for (let i = 0; i < count; i++) {
      const reporter = pick(random, reporters);
      if (!reporter.id) continue;
      const roll = random();
      const outcome = roll < 0.68 ? 'fixed' : roll < 0.8 ? 'partly' : roll < 0.91 ? 'not_fixed' : 'came_back';
      const revisions: number[] = fix.revision_ids;
      const revisionId = revisions.length > 1 && random() < 0.3 ? pick(random, revisions.slice(0, -1)) : fix.current_revision_id;
      const rows = await knex('bench_reports')
        .insert({
          fix_id: fix.id,
          revision_id: revisionId,
          machine_id: pick(random, machineIds),
          member_id: reporter.id,
          outcome,
          held_days: outcome === 'came_back' ? 20 + Math.floor(random() * 200) : null,
          note: pick(random, notes[outcome] ?? ['']),
        })
        .onConflict(['fix_id', 'member_id', 'machine_id'])
        .ignore()
        .returning('id');
      inserted += rows.length;
    }
  }
  return inserted;
}

function seedOf(text: string): number {
  let h = 2166136261;
  for (const ch of text) h = Math.imul(h ^ ch.charCodeAt(0), 16777619);
  return h >>> 0;
}
