// The local SMTP sink's folder: one JSON file per received message, written by scripts/mail-sink.ts.
import { mkdir, readFile, readdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import { z } from 'zod';
import type { Config } from '../core/config';

export const storedMailSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  date: z.string(),
  /** Lower-case header name → value, for the headers the sink keeps (List-*). */
  headers: z.record(z.string(), z.string()).optional(),
});
export type StoredMail = z.infer<typeof storedMailSchema>;

/** Ids sort by arrival: milliseconds, then random hex so two messages in one millisecond never clash. */
const idPattern = /^\d{13}-[0-9a-f]{8}$/;

export function mailDir(settings: Pick<Config, 'BENCHLORE_MAIL_DIR' | 'BENCHLORE_DATA_DIR'>): string {
  return settings.BENCHLORE_MAIL_DIR ?? join(settings.BENCHLORE_DATA_DIR, 'mail');
}

export function newMailId(now: number = Date.now()): string {
  return `${String(now).padStart(13, '0')}-${randomBytes(4).toString('hex')}`;
}

export async function storeMail(dir: string, mail: Omit<StoredMail, 'id'>): Promise<StoredMail> {
  await mkdir(dir, { recursive: true });
  const stored: StoredMail = { id: newMailId(), ...mail };
  await writeFile(join(dir, `${stored.id}.json`), JSON.stringify(stored, null, 2), { mode: 0o600 });
  return stored;
}

/** Newest first; unreadable files are skipped rather than failing the whole list. */
export async function listMail(dir: string, limit = 200): Promise<StoredMail[]> {
  let names: string[];
  try {
    names = await readdir(dir);
  } catch {
    return [];
  }
  const ids = names
    .filter((name) => name.endsWith('.json'))
    .map((name) => name.slice(0, -'.json'.length))
    .filter((id) => idPattern.test(id))
    .sort()
    .reverse()
    .slice(0, limit);
  const messages = await Promise.all(ids.map((id) => readMail(dir, id)));
  return messages.filter((m): m is StoredMail => m !== null);
}

/** One message by id; null for an id that is malformed (never a path) or not there. */
export async function readMail(dir: string, id: string): Promise<StoredMail | null> {
  if (!idPattern.test(id)) return null;
  try {
    const parsed = storedMailSchema.safeParse(JSON.parse(await readFile(join(dir, `${id}.json`), 'utf8')));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}
