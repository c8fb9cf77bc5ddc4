// Reads one photo upload (a file and its alt text and caption) from a multipart request, streamed with hard limits.
import { Readable } from 'node:stream';
import busboy from 'busboy';
import { refuse, succeed, type Outcome } from '../http/result';
import { MAX_CAPTION_LENGTH } from '@/lib/schemas/photo-text';
import { MAX_PHOTO_BYTES, MAX_UPLOAD_REQUEST_BYTES } from './upload-limits';

export interface PhotoUpload {
  bytes: Buffer;
  filename: string;
  fields: Record<string, string>;
}

const megabytes = (n: number) => `${Math.round(n / (1024 * 1024))} MB`;
const tooLarge = () =>
  refuse(
    'payload_too_large',
    `The photo is larger than ${megabytes(MAX_PHOTO_BYTES)}. Save it smaller (a long side of about 3000 pixels is plenty) and try again.`,
  );

/** Refuses before reading a byte when the declared length is already too large. */
export function checkDeclaredLength(request: Request): Outcome<null> {
  const declared = request.headers.get('content-length');
  if (declared !== null && (!/^\d+$/.test(declared) || Number(declared) > MAX_UPLOAD_REQUEST_BYTES)) return tooLarge();
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('multipart/form-data'))
    return refuse('unsupported_media_type', 'Send the photo as multipart/form-data with a "file" field.');
  return succeed(null);
}

/**
 * Streams the body through busboy: one file of at most 12 MB, a few short fields. A chunked body without a
 * length is cut off by the same limits, so nothing larger is ever held in memory.
 */
export function readPhotoUpload(request: Request): Promise<Outcome<PhotoUpload>> {
  const declared = checkDeclaredLength(request);
  if (!declared.ok) return Promise.resolve(declared);
  if (!request.body) return Promise.resolve(refuse('bad_request', 'The upload was empty.'));
  return new Promise((resolve) => {
    let settled = false;
    const finish = (outcome: Outcome<PhotoUpload>) => {
      if (settled) return;
      settled = true;
      resolve(outcome);
    };
    let parser: busboy.Busboy;
    try {
      parser = busboy({
        headers: Object.fromEntries(request.headers),
        limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 6, fieldSize: MAX_CAPTION_LENGTH * 4, parts: 8 },
      });
    } catch {
      finish(refuse('bad_request', 'The upload could not be read: the multipart boundary is missing.'));
      return;
    }
    const fields: Record<string, string> = {};
    const chunks: Buffer[] = [];
    let filename = '';
    let sawFile = false;
    let truncated = false;
    parser.on('field', (name, value, info) => {
      if (info.valueTruncated) truncated = true;
      fields[name] = value;
    });
    parser.on('file', (name, stream, info) => {
      if (name !== 'file') {
        stream.resume();
        return;
      }
      sawFile = true;
      filename = info.filename ?? '';
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('limit', () => finish(tooLarge()));
    });
    parser.on('filesLimit', () => finish(refuse('bad_request', 'Send one photo per upload.')));
    parser.on('partsLimit', () => finish(refuse('bad_request', 'The upload has more parts than a photo and its alt text and caption.')));
    parser.on('error', () => finish(refuse('bad_request', 'The upload was cut off or is not valid multipart data; try again.')));
    parser.on('close', () => {
      if (!sawFile) return finish(refuse('bad_request', 'Choose a photo to upload.', { file: ['Choose a photo to upload.'] }));
      if (truncated) return finish(refuse('bad_request', 'The alt text or caption is too long.'));
      const bytes = Buffer.concat(chunks);
      if (bytes.length === 0) return finish(refuse('bad_request', 'The photo file is empty.', { file: ['The photo file is empty.'] }));
      finish(succeed({ bytes, filename, fields }));
    });
    const source = Readable.fromWeb(request.body as import('node:stream/web').ReadableStream<Uint8Array>);
    source.on('error', () => finish(refuse('bad_request', 'The upload was cut off before it finished; try again.')));
    // Past the limits busboy discards the rest; a body far beyond them (chunked, no length) is cut off outright.
    let received = 0;
    source.on('data', (chunk: Buffer) => {
      received += chunk.length;
      if (received > 2 * MAX_UPLOAD_REQUEST_BYTES) {
        finish(tooLarge());
        source.destroy();
      }
    });
    source.pipe(parser);
  });
}
