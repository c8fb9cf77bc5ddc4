// Takes in an uploaded photo: checks type, size and pixels, refuses duplicates, and queues its renditions.
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { photoTextSchema } from '@/lib/schemas/photo-text';
import { issuesToFields, refuse, succeed, type Outcome, type Writer } from '../http/result';
import { MAX_INPUT_PIXELS, openImage, readImageHeader } from './sharp-factory';
import { sniffPhotoType } from './sniff';
import { photoRef, type PhotoRef } from './photo-refs';

export type IntakeOutcome = Outcome<PhotoRef>;

const megapixels = (n: number) => `${Math.round(n / 1_000_000)} megapixels`;

/** Decodes the whole image once, small, so a truncated or corrupt file is refused now rather than later. */
async function decodesCleanly(bytes: Buffer): Promise<boolean> {
  try {
    await openImage(bytes).resize(64, 64, { fit: 'inside' }).raw().toBuffer();
    return true;
  } catch {
    return false;
  }
}

export async function takeInPhoto(knex: Knex, owner: Writer, bytes: Buffer, rawFields: Record<string, string>): Promise<IntakeOutcome> {
  const text = photoTextSchema.safeParse({ alt: rawFields.alt ?? '', caption: rawFields.caption ?? '' });
  if (!text.success) return refuse('bad_request', 'The photo needs alt text.', issuesToFields(text.error.issues));
  const type = await sniffPhotoType(bytes);
  if (!type.ok) return type;
  const header = await readImageHeader(bytes);
  if (!header)
    return refuse('bad_request', 'The image could not be read: the file may be damaged. Save it again as JPEG or PNG.', {
      file: ['The image could not be read.'],
    });
  if (header.width * header.height > MAX_INPUT_PIXELS) {
    const message = `The image is ${header.width} × ${header.height} pixels (${megapixels(header.width * header.height)}); the largest we take is ${megapixels(MAX_INPUT_PIXELS)}. Scale it down and upload it again.`;
    return refuse('payload_too_large', message, { file: [message] });
  }
  if (!(await decodesCleanly(bytes))) {
    const message = 'The image is damaged or cut off part-way (its data does not decode). Save it again as JPEG or PNG and upload that.';
    return refuse('bad_request', message, { file: [message] });
  }
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  const existing = await knex('photos').where({ sha256 }).whereNull('deleted_at').first('id');
  if (existing) return duplicate(knex, owner, existing.id);
  try {
    const id = await knex.transaction(async (trx) => {
      const [row] = await trx('photos')
        .insert({
          owner_id: owner.id,
          // A placeholder until the renditions exist: the upload itself waits in photo_uploads, never in public storage.
          storage_key: `uploads/${sha256}`,
          mime_type: type.value,
          byte_size: bytes.length,
          width: header.width,
          height: header.height,
          sha256,
          alt_text: text.data.alt,
          caption: text.data.caption,
          processing_state: 'pending',
        })
        .returning('id');
      await trx('photo_uploads').insert({ photo_id: row.id, bytes });
      return row.id as number;
    });
    return succeed((await photoRef(knex, id))!);
  } catch (error) {
    const e = error as { code?: string; constraint?: string };
    if (e.code === '23505' && e.constraint === 'photos_sha256_unique') {
      const again = await knex('photos').where({ sha256 }).whereNull('deleted_at').first('id');
      if (again) return duplicate(knex, owner, again.id);
    }
    throw error;
  }
}

/** 409 with the existing photo's id; the photo itself comes along when the uploader may use it (theirs, or already public). */
async function duplicate(knex: Knex, owner: Writer, photoId: number): Promise<IntakeOutcome> {
  const usable = await knex('photos as p')
    .where('p.id', photoId)
    .where((q) =>
      q
        .where('p.owner_id', owner.id)
        .orWhereExists(
          knex('revision_photos as rp')
            .join('revisions as r', 'r.id', 'rp.revision_id')
            .whereRaw('rp.photo_id = p.id')
            .whereNot('r.state', 'draft'),
        ),
    )
    .first('p.id');
  if (usable)
    return refuse('conflict', 'This photo was uploaded before; the existing copy is used.', undefined, {
      photoId,
      photo: await photoRef(knex, photoId),
    });
  return refuse(
    'conflict',
    'Someone else has already uploaded this exact photo, and it cannot be used twice. Take or choose another.',
    undefined,
    { photoId },
  );
}
