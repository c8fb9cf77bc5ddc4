// Seeds the demo fixes with their proofed revisions and illustrations; a fix already present is left alone.
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import sharp from 'sharp';
import { demoFixes } from './demo/fixes';
import { drawIllustration } from './demo/illustrations';
import type { DemoFix, DemoIllustration } from './demo/types';
import { required, type SeededIds } from './seed-catalogue';
import { makeRenditions } from '../photos/renditions';
import { storage } from '../storage';
import { refreshFixSearchRow } from '../search/fix-search-row';

const DAY = 86_400_000;
/** Demo revisions are dated from here on, a few days apart, so "when proofed" reads naturally. */
const EPOCH = Date.parse('2024-02-01T10:00:00Z');

export async function seedFixes(knex: Knex, ids: SeededIds): Promise<{ created: number }> {
  let created = 0;
  for (const [index, fix] of demoFixes.entries()) {
    const exists = await knex('fixes').where({ slug: fix.slug }).first('id');
    if (exists) continue;
    await knex.transaction((trx) => seedOneFix(trx, ids, fix, index));
    created++;
  }
  return { created };
}

async function seedOneFix(trx: Knex.Transaction, ids: SeededIds, fix: DemoFix, index: number): Promise<void> {
  const first = fix.revisions[0];
  if (!first) throw new Error(`Demo fix ${fix.slug} has no revision`);
  const machineIds = fix.machines.map((k) => required(ids.machines, k, 'machine'));
  const chassisIds = fix.chassis.map((k) => required(ids.chassis, k, 'chassis family'));
  const [{ id: fixId }] = await trx('fixes')
    .insert({ slug: fix.slug, created_by: required(ids.users, first.author, 'user'), created_at: new Date(EPOCH + index * 5 * DAY) })
    .returning('id');

  let parentId: number | null = null;
  for (const [n, rev] of fix.revisions.entries()) {
    const when = new Date(EPOCH + index * 5 * DAY + n * 40 * DAY);
    const inserted: { id: number }[] = await trx('revisions')
      .insert({
        fix_id: fixId,
        number: n + 1,
        parent_revision_id: parentId,
        author_id: required(ids.users, rev.author, 'user'),
        title: rev.title,
        body: JSON.stringify(rev.body),
        symptoms: rev.symptoms,
        error_codes: rev.errorCodes,
        cause: rev.cause,
        parts: JSON.stringify(rev.parts),
        readings: JSON.stringify(rev.readings),
        cautions: JSON.stringify(rev.cautions),
        difficulty: rev.difficulty,
        time_minutes: rev.timeMinutes,
        edit_summary: rev.editSummary,
        state: 'proofed',
        proofer_id: required(ids.users, rev.proofer, 'user'),
        created_at: new Date(when.getTime() - DAY),
        updated_at: when,
        submitted_at: new Date(when.getTime() - DAY / 2),
        proofed_at: when,
      })
      .returning('id');
    const revisionId = inserted[0]?.id;
    if (revisionId === undefined) throw new Error(`Demo fix ${fix.slug}: revision ${n + 1} was not inserted`);
    if (machineIds.length) await trx('revision_machines').insert(machineIds.map((machine_id) => ({ revision_id: revisionId, machine_id })));
    if (chassisIds.length)
      await trx('revision_chassis').insert(chassisIds.map((chassis_family_id) => ({ revision_id: revisionId, chassis_family_id })));
    for (const [position, illustration] of (rev.illustrations ?? []).entries()) {
      const photoId = await seedIllustration(trx, required(ids.users, rev.author, 'user'), illustration);
      await trx('revision_photos')
        .insert({ revision_id: revisionId, photo_id: photoId, position })
        .onConflict(['revision_id', 'photo_id'])
        .ignore();
    }
    parentId = revisionId;
  }
  await trx('fixes').where({ id: fixId }).update({ current_revision_id: parentId });
  if (machineIds.length) await trx('fix_machines').insert(machineIds.map((machine_id) => ({ fix_id: fixId, machine_id })));
  if (chassisIds.length) await trx('fix_chassis').insert(chassisIds.map((chassis_family_id) => ({ fix_id: fixId, chassis_family_id })));
  await refreshFixSearchRow(trx, fixId);
}

/** Draws the illustration, renders it with sharp and stores its renditions; reuses an identical one. */
async function seedIllustration(trx: Knex.Transaction, ownerId: number, illustration: DemoIllustration): Promise<number> {
  const png = await sharp(Buffer.from(drawIllustration(illustration.drawing)))
    .png()
    .toBuffer();
  const sha256 = createHash('sha256').update(png).digest('hex');
  const existing = await trx('photos').where({ sha256 }).whereNull('deleted_at').first('id');
  if (existing) return existing.id;
  const prefix = `photos/${sha256.slice(0, 2)}/${sha256.slice(0, 16)}`;
  const { width, height, renditions } = await makeRenditions(png, prefix);
  for (const r of renditions) await storage().put(r.key, r.body, r.format === 'webp' ? 'image/webp' : 'image/jpeg');
  const [{ id }] = await trx('photos')
    .insert({
      owner_id: ownerId,
      storage_key: `${prefix}-source.png`,
      mime_type: 'image/png',
      byte_size: png.length,
      width,
      height,
      sha256,
      renditions: JSON.stringify(renditions.map(({ body: _body, ...r }) => r)),
      alt_text: illustration.alt,
      caption: illustration.caption,
      is_illustration: true,
    })
    .returning('id');
  await storage().put(`${prefix}-source.png`, png, 'image/png');
  return id;
}
