// Changing a photo's alt text and caption: by its owner, while no revision past draft shows it.
import type { Knex } from 'knex';
import { refuse, succeed, type Outcome, type Writer } from '../http/result';
import { photoRef, type PhotoRef } from './photo-refs';

export async function updatePhotoText(
  knex: Knex,
  owner: Writer,
  photoId: number,
  text: { alt: string; caption: string },
): Promise<Outcome<PhotoRef>> {
  const photo = await knex('photos').where({ id: photoId }).whereNull('deleted_at').first('owner_id');
  if (!photo || photo.owner_id !== owner.id) return refuse('not_found', 'There is no such photo among yours.');
  const published = await knex('revision_photos as rp')
    .join('revisions as r', 'r.id', 'rp.revision_id')
    .where('rp.photo_id', photoId)
    .whereNot('r.state', 'draft')
    .first('r.id');
  // A submitted revision is never changed in place, and its photos' words are part of it.
  if (published)
    return refuse(
      'conflict',
      'This photo is part of a submitted revision, so its alt text and caption stay as they were. Upload it again to describe it differently.',
    );
  await knex('photos').where({ id: photoId }).update({ alt_text: text.alt, caption: text.caption });
  return succeed((await photoRef(knex, photoId))!);
}
