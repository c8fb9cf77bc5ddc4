// The weekly file at /export: the knowledge export of the current ISO week, built on the first request of the week,
// kept on disk under BENCHLORE_DATA_DIR/export/weekly/<week>, and served from there (a file read, no queries).
import { createReadStream } from 'node:fs';
import { mkdir, mkdtemp, readFile, rename, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { config } from '../core/config';
import { db } from '../core/db';
import { logger } from '../core/logger';
import { writeKnowledgeExport, type ExportManifest } from './knowledge-export';

/** The ISO 8601 week of a date, e.g. 2026-W49 (weeks start on Monday; week 1 holds the year's first Thursday). */
export function isoWeek(date: Date): string {
  const day = new Date(Date.UTC(date.getUTCFullYear(), date.getUTCMonth(), date.getUTCDate()));
  const weekday = day.getUTCDay() || 7;
  day.setUTCDate(day.getUTCDate() + 4 - weekday);
  const yearStart = Date.UTC(day.getUTCFullYear(), 0, 1);
  const week = Math.ceil(((day.getTime() - yearStart) / 86_400_000 + 1) / 7);
  return `${day.getUTCFullYear()}-W${String(week).padStart(2, '0')}`;
}

/** One folder per database, so databases sharing a data folder (tests, staging) never serve each other's file. */
export function weeklyRoot(): string {
  return join(config().BENCHLORE_DATA_DIR, 'export', 'weekly', config().BENCHLORE_DB_NAME);
}

let building: Promise<WeeklyExport> | null = null;

export interface WeeklyExport {
  week: string;
  dir: string;
  manifest: ExportManifest;
}

async function readManifest(dir: string): Promise<ExportManifest | null> {
  try {
    return JSON.parse(await readFile(join(dir, 'manifest.json'), 'utf8')) as ExportManifest;
  } catch {
    return null;
  }
}

/** Builds into a scratch folder and renames it into place, so a reader never sees half a file. */
async function build(week: string, dir: string): Promise<WeeklyExport> {
  const scratch = await mkdtemp(join(weeklyRoot(), `.building-${week}-`));
  try {
    const manifest = await writeKnowledgeExport(db(), scratch, config().PUBLIC_ORIGIN);
    try {
      await rename(scratch, dir);
    } catch (error) {
      // Another process finished the same week first: keep theirs.
      const theirs = await readManifest(dir);
      if (!theirs) throw error;
      await rm(scratch, { recursive: true, force: true });
      return { week, dir, manifest: theirs };
    }
    logger().info({ week, fixes: manifest.counts.fixes }, 'weekly export written');
    return { week, dir, manifest };
  } catch (error) {
    await rm(scratch, { recursive: true, force: true });
    throw error;
  }
}

/** This week's export, built once if it is not on disk yet. */
export async function currentWeeklyExport(now: Date = new Date()): Promise<WeeklyExport> {
  const week = isoWeek(now);
  const dir = join(weeklyRoot(), week);
  const kept = await readManifest(dir);
  if (kept) return { week, dir, manifest: kept };
  if (!building) {
    await mkdir(weeklyRoot(), { recursive: true });
    building = build(week, dir).finally(() => {
      building = null;
    });
  }
  return building;
}

/** The export's data file as a stream for the response body, with its size. */
export async function weeklyFile(exported: WeeklyExport, name: 'fixes.jsonl'): Promise<{ body: ReadableStream; bytes: number }> {
  const path = join(exported.dir, name);
  const { size } = await stat(path);
  return { body: Readable.toWeb(createReadStream(path)) as ReadableStream, bytes: size };
}
