// Photos as pages show them: alt text, caption, sizes and srcsets of their renditions.
import { db } from '../core/db';
import { mediaUrl } from '../storage';
import type { Rendition } from './renditions';

export interface PhotoView {
  id: number;
  alt: string;
  caption: string;
  width: number;
  height: number;
  isIllustration: boolean;
  /** The middle JPEG: the fallback src. */
  src: string;
  srcsetWebp: string;
  srcsetJpeg: string;
}

export function toPhotoView(row: {
  id: number;
  alt_text: string;
  caption: string;
  width: number;
  height: number;
  is_illustration: boolean;
  renditions: Rendition[];
}): PhotoView {
  const jpegs = row.renditions.filter((r) => r.format === 'jpeg').sort((a, b) => a.width - b.width);
  const webps = row.renditions.filter((r) => r.format === 'webp').sort((a, b) => a.width - b.width);
  const srcset = (list: Rendition[]) => list.map((r) => `${mediaUrl(r.key)} ${r.width}w`).join(', ');
  const fallback = jpegs[Math.min(1, jpegs.length - 1)];
  return {
    id: row.id,
    alt: row.alt_text,
    caption: row.caption,
    width: row.width,
    height: row.height,
    isIllustration: row.is_illustration,
    src: fallback ? mediaUrl(fallback.key) : '',
    srcsetWebp: srcset(webps),
    srcsetJpeg: srcset(jpegs),
  };
}

export async function photosOfRevisions(revisionIds: number[]): Promise<Map<number, PhotoView[]>> {
  const byRevision = new Map<number, PhotoView[]>();
  if (revisionIds.length === 0) return byRevision;
  const rows = await db()('revision_photos as rp')
    .join('photos as p', 'p.id', 'rp.photo_id')
    .whereIn('rp.revision_id', revisionIds)
    .whereNull('p.deleted_at')
    .orderBy(['rp.revision_id', 'rp.position'])
    .select('rp.revision_id', 'p.id', 'p.alt_text', 'p.caption', 'p.width', 'p.height', 'p.is_illustration', 'p.renditions');
  for (const row of rows) {
    const list = byRevision.get(row.revision_id) ?? [];
    list.push(toPhotoView(row));
    byRevision.set(row.revision_id, list);
  }
  return byRevision;
}
