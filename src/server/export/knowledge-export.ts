// The full export of the proofed knowledge under its licence: every live fix's live revision as one JSON line,
// with what it applies to, its bench-score counts, its photos' addresses and who to credit. No private data:
// no job sheets, notes, e-mail addresses, drafts or hidden fixes.
import { createHash } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { once } from 'node:events';
import type { Knex } from 'knex';
import { getFix } from '../fixes/fixes';
import { mediaUrl } from '../storage';
import type { Rendition } from '../photos/renditions';

export const EXPORT_LICENCE = {
  name: 'CC BY-SA 4.0',
  url: 'https://creativecommons.org/licenses/by-sa/4.0/',
  terms: '/help/content-licence',
} as const;

export interface ExportedFix {
  slug: string;
  url: string;
  licence: string;
  revision: {
    number: number;
    proofedAt: string | null;
    title: string;
    symptoms: string[];
    errorCodes: string[];
    cause: string;
    parts: unknown[];
    readings: unknown[];
    cautions: unknown[];
    difficulty: string | null;
    timeMinutes: number | null;
    body: unknown;
  };
  machines: { slug: string; maker: string; modelNumber: string; region: string }[];
  chassisFamilies: { slug: string; name: string; code: string }[];
  makers: string[];
  benchReports: { counted: number; fixed: number; partly: number; notFixed: number; cameBack: number };
  photos: { altText: string; caption: string; renditions: { url: string; width: number; format: string }[] }[];
  /** Everyone whose proofed revisions led to this text, as the site credits them. */
  attribution: { name: string; role: 'author' | 'proofer' }[];
}

export interface ExportManifest {
  format: 'benchlore-knowledge-export';
  version: 1;
  createdAt: string;
  licence: typeof EXPORT_LICENCE;
  counts: { fixes: number; machines: number; chassisFamilies: number; makers: number; photos: number };
  files: { name: string; lines: number; bytes: number; sha256: string }[];
}

/** Live fixes readers can see, in a stable order. */
async function liveFixSlugs(knex: Knex): Promise<string[]> {
  const rows: { slug: string }[] = await knex('fixes')
    .whereNotNull('current_revision_id')
    .whereNull('hidden_at')
    .whereNull('deleted_at')
    .orderBy('slug')
    .select('slug');
  return rows.map((r) => r.slug);
}

async function photosOf(knex: Knex, revisionId: number, origin: string): Promise<ExportedFix['photos']> {
  const rows: { alt_text: string; caption: string; renditions: Rendition[] }[] = await knex('revision_photos as rp')
    .join('photos as p', 'p.id', 'rp.photo_id')
    .where('rp.revision_id', revisionId)
    .whereNull('p.deleted_at')
    .orderBy('rp.position')
    .select('p.alt_text', 'p.caption', 'p.renditions');
  return rows.map((p) => ({
    altText: p.alt_text,
    caption: p.caption,
    renditions: [...p.renditions]
      .sort((a, b) => a.format.localeCompare(b.format) || a.width - b.width)
      .map((r) => ({ url: new URL(mediaUrl(r.key), origin).href, width: r.width, format: r.format })),
  }));
}

async function attributionOf(knex: Knex, fixSlug: string, liveNumber: number): Promise<ExportedFix['attribution']> {
  const rows: { author: string | null; proofer: string | null }[] = await knex('revisions as r')
    .join('fixes as f', 'f.id', 'r.fix_id')
    .join('users as a', 'a.id', 'r.author_id')
    .leftJoin('users as p', 'p.id', 'r.proofer_id')
    .where('f.slug', fixSlug)
    .where('r.state', 'proofed')
    .where('r.number', '<=', liveNumber)
    .orderBy('r.number')
    .select('a.name as author', 'p.name as proofer');
  const credits: ExportedFix['attribution'] = [];
  const seen = new Set<string>();
  const add = (name: string | null, role: 'author' | 'proofer') => {
    const shown = name ?? 'a former member';
    if (!seen.has(`${role}:${shown}`)) credits.push({ name: shown, role });
    seen.add(`${role}:${shown}`);
  };
  for (const r of rows) add(r.author, 'author');
  for (const r of rows) if (r.proofer) add(r.proofer, 'proofer');
  return credits;
}

/** Every live fix as an export record, one at a time, so a large catalogue never sits in memory. */
export async function* exportedFixes(knex: Knex, origin: string): AsyncGenerator<ExportedFix> {
  for (const slug of await liveFixSlugs(knex)) {
    const fix = await getFix(slug);
    if (!fix) continue;
    const r = fix.revision;
    yield {
      slug: fix.slug,
      url: new URL(`/fixes/${fix.slug}`, origin).href,
      licence: EXPORT_LICENCE.name,
      revision: {
        number: r.number,
        proofedAt: r.proofedAt ? r.proofedAt.toISOString() : null,
        title: r.title,
        symptoms: r.symptoms,
        errorCodes: r.errorCodes,
        cause: r.cause,
        parts: r.parts,
        readings: r.readings,
        cautions: r.cautions,
        difficulty: r.difficulty,
        timeMinutes: r.timeMinutes,
        body: r.body,
      },
      machines: fix.machines.map((m) => ({ slug: m.slug, maker: m.makerName, modelNumber: m.modelNumber, region: m.region })),
      chassisFamilies: fix.chassis.map((c) => ({ slug: c.slug, name: c.name, code: c.code })),
      makers: [...new Set(fix.machines.map((m) => m.makerName))].sort(),
      benchReports: {
        counted: fix.benchScore.counted,
        fixed: fix.benchScore.fixed,
        partly: fix.benchScore.partly,
        notFixed: fix.benchScore.notFixed,
        cameBack: fix.benchScore.cameBack,
      },
      photos: await photosOf(knex, r.id, origin),
      attribution: await attributionOf(knex, fix.slug, r.number),
    };
  }
}

/** Writes fixes.jsonl and manifest.json into `dir`; the manifest counts and checksums what was written. */
export async function writeKnowledgeExport(knex: Knex, dir: string, origin: string): Promise<ExportManifest> {
  await mkdir(dir, { recursive: true });
  const hash = createHash('sha256');
  const out = createWriteStream(join(dir, 'fixes.jsonl'));
  let lines = 0;
  let bytes = 0;
  let photos = 0;
  const machines = new Set<string>();
  const chassis = new Set<string>();
  const makers = new Set<string>();
  for await (const record of exportedFixes(knex, origin)) {
    const line = `${JSON.stringify(record)}\n`;
    hash.update(line);
    bytes += Buffer.byteLength(line);
    lines += 1;
    photos += record.photos.length;
    record.machines.forEach((m) => machines.add(m.slug));
    record.chassisFamilies.forEach((c) => chassis.add(c.slug));
    record.makers.forEach((m) => makers.add(m));
    if (!out.write(line)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
  const manifest: ExportManifest = {
    format: 'benchlore-knowledge-export',
    version: 1,
    createdAt: new Date().toISOString(),
    licence: EXPORT_LICENCE,
    counts: { fixes: lines, machines: machines.size, chassisFamilies: chassis.size, makers: makers.size, photos },
    files: [{ name: 'fixes.jsonl', lines, bytes, sha256: hash.digest('hex') }],
  };
  await writeFile(join(dir, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);
  return manifest;
}
