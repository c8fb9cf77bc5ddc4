// The manifest inside every backup file: what it holds, with checksums to verify before and after a restore.
import { createHash } from 'node:crypto';
import { z } from 'zod';

const sha256 = z.string().regex(/^[0-9a-f]{64}$/);

export const manifestSchema = z.object({
  format: z.literal('benchlore-backup'),
  version: z.literal(1),
  createdAt: z.string(),
  /** The newest migration the database had, so a restore into older code is noticed. */
  latestMigration: z.string().nullable(),
  database: z.object({ file: z.literal('database.dump'), bytes: z.number().int().nonnegative(), sha256 }),
  tables: z.record(z.string(), z.object({ rows: z.number().int().nonnegative(), md5: z.string() })),
  photos: z.array(z.object({ key: z.string(), file: z.string(), contentType: z.string(), bytes: z.number().int().nonnegative(), sha256 })),
  /** Storage keys the database names but the store did not have when the backup was made. */
  missingPhotos: z.array(z.string()),
});

export type Manifest = z.infer<typeof manifestSchema>;

export function sha256Of(bytes: Buffer): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** Storage keys become flat file names inside the backup; the manifest maps them back. */
export function photoFileName(index: number): string {
  return `photos/${String(index).padStart(6, '0')}`;
}
