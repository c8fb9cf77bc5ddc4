// Photos as the editor and the proofing desk see them: processing state, alt text, caption, sources to show.
import type { Knex } from 'knex';
import { mediaUrl } from '../storage';
import type { Rendition } from './renditions';

export type ProcessingState = 'pending' | 'ready' | 'failed';

export interface PhotoRef {
  id: number;
  ownerId: number;
  alt: string;
  caption: string;
  state: ProcessingState;
  /** Why renditions could not be made, in words for the writer. */
  error: string | null;
  width: number;
  height: number;
  /** Smallest JPEG rendition, for thumbnails; null until renditions exist. */
  thumbSrc: string | null;
  /** The JPEG of about 960 px a figure in the remedy points at; null until renditions exist. */
  figureSrc: string | null;
}

export interface PhotoRow {
  id: number;
  owner_id: number;
  alt_text: string;
  caption: string;
  processing_state: ProcessingState;
  processing_error: string | null;
  width: number;
  height: number;
  renditions: Rendition[];
}

export const photoRefColumns = [
  'p.id',
  'p.owner_id',
  'p.alt_text',
  'p.caption',
  'p.processing_state',
  'p.processing_error',
  'p.width',
  'p.height',
  'p.renditions',
];

export function toPhotoRef(row: PhotoRow): PhotoRef {
  const jpegs = row.renditions.filter((r) => r.format === 'jpeg').sort((a, b) => a.width - b.width);
  const figure = [...jpegs].reverse().find((r) => r.width <= 960) ?? jpegs[0];
  return {
    id: row.id,
    ownerId: row.owner_id,
    alt: row.alt_text,
    caption: row.caption,
    state: row.processing_state,
    error: row.processing_error,
    width: row.width,
    height: row.height,
    thumbSrc: jpegs[0] ? mediaUrl(jpegs[0].key) : null,
    figureSrc: figure ? mediaUrl(figure.key) : null,
  };
}

export async function photoRef(knex: Knex, photoId: number): Promise<PhotoRef | null> {
  const row: PhotoRow | undefined = await knex('photos as p').where('p.id', photoId).whereNull('p.deleted_at').first(photoRefColumns);
  return row ? toPhotoRef(row) : null;
}
