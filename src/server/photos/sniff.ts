// Tells what an uploaded file really is from its bytes (never from its name or the browser's word for it).
import { fileTypeFromBuffer } from 'file-type';
import { refuse, succeed, type Outcome } from '../http/result';
import { acceptedPhotoTypes, type AcceptedPhotoType } from './upload-limits';

const heicTypes = new Set(['image/heic', 'image/heif', 'image/heic-sequence', 'image/heif-sequence']);

export async function sniffPhotoType(bytes: Buffer): Promise<Outcome<AcceptedPhotoType>> {
  const found = await fileTypeFromBuffer(bytes);
  if (found && (acceptedPhotoTypes as readonly string[]).includes(found.mime)) return succeed(found.mime as AcceptedPhotoType);
  const field = (message: string) => refuse('unsupported_media_type', message, { file: [message] });
  if (found && heicTypes.has(found.mime)) {
    return field(
      'This is a HEIC/HEIF photo, which we cannot take yet. Convert it to JPEG or PNG (most phones can save or share as JPEG) and upload that.',
    );
  }
  if (found)
    return field(
      `This file is ${found.ext.toUpperCase()} (${found.mime}), not a photo we take. Upload a JPEG, PNG, WebP or AVIF image; convert anything else to JPEG or PNG first.`,
    );
  return field(
    'This file does not look like an image. Upload a JPEG, PNG, WebP or AVIF photo; convert anything else to JPEG or PNG first.',
  );
}
