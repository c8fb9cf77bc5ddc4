// Photo uploads through the built server: 202 then renditions made off the request path, metadata stripped,
// orientation applied, duplicates refused by hash, and every kind of bad file refused with its own message.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { session, type Session } from '../fixtures/writing';
import {
  hasGpsPointer,
  heicHeader,
  hugePng,
  phoneJpeg,
  pngHeaderThenGarbage,
  pngWithGarbageData,
  zipArchive,
} from '../fixtures/photo-files';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let writer: Session;

beforeAll(async () => {
  writer = await session(knex, base, 'member', 'photos');
});
afterAll(() => knex.destroy());

async function upload(
  file: Buffer,
  name: string,
  fields: Record<string, string> = { alt: 'The capstan pulley with the belt fitted', caption: 'After cleaning' },
  cookie = writer.cookie,
) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append('file', new Blob([new Uint8Array(file)]), name);
  const response = await fetch(`${base}/api/v1/photos`, { method: 'POST', headers: { cookie, origin: base }, body: form });
  return { status: response.status, body: await response.json() };
}

async function waitReady(id: number) {
  for (let i = 0; i < 120; i++) {
    const response = await fetch(`${base}/api/v1/photos/${id}`, { headers: { cookie: writer.cookie } });
    const body = await response.json();
    if (body.photo.state !== 'pending') return body.photo;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error('photo still pending');
}

describe('a photo from a phone', () => {
  it('answers 202 at once, then serves renditions without EXIF or GPS, turned upright', async () => {
    const original = await phoneJpeg();
    const input = await sharp(original).metadata();
    expect(input.orientation).toBe(6);
    expect(hasGpsPointer(input.exif)).toBe(true);

    const answer = await upload(original, 'IMG_0042.JPG');
    expect(answer.status).toBe(202);
    expect(answer.body.photo.state).toBe('pending');
    const photo = await waitReady(answer.body.photo.id);
    expect(photo.state).toBe('ready');
    expect([photo.width, photo.height]).toEqual([1200, 2000]);

    const row = await knex('photos').where({ id: photo.id }).first();
    expect(row.byte_size).toBe(original.length);
    expect(row.mime_type).toBe('image/jpeg');
    expect(row.alt_text).toBe('The capstan pulley with the belt fitted');
    expect(row.caption).toBe('After cleaning');
    expect(await knex('photo_uploads').where({ photo_id: photo.id }).first()).toBeUndefined();
    // 1200 px wide once upright: the 480 and 960 sizes, each as WebP and JPEG; never AVIF, never larger than the original.
    expect(row.renditions.map((r: { width: number; format: string }) => `${r.width}.${r.format}`).sort()).toEqual([
      '480.jpeg',
      '480.webp',
      '960.jpeg',
      '960.webp',
    ]);

    for (const rendition of row.renditions as { key: string; width: number; height: number; format: string }[]) {
      const served = await fetch(`${base}/media/${rendition.key}`);
      expect(served.status).toBe(200);
      expect(served.headers.get('content-type')).toBe(rendition.format === 'webp' ? 'image/webp' : 'image/jpeg');
      const bytes = Buffer.from(await served.arrayBuffer());
      const meta = await sharp(bytes).metadata();
      expect(meta.format).toBe(rendition.format);
      expect([meta.width, meta.height]).toEqual([rendition.width, Math.round((rendition.width * 2000) / 1200)]);
      expect(meta.exif).toBeUndefined();
      expect(meta.orientation).toBeUndefined();
      expect(bytes.includes(Buffer.from('Invented Camera Co'))).toBe(false);
      // Upright: the stored image's left (red) half is now the top.
      const { data } = await sharp(bytes).resize(2, 2, { fit: 'fill' }).raw().toBuffer({ resolveWithObject: true });
      const [topR, , topB] = [data[0]!, data[1]!, data[2]!];
      const [bottomR, , bottomB] = [data[6]!, data[7]!, data[8]!];
      expect(topR).toBeGreaterThan(topB);
      expect(bottomB).toBeGreaterThan(bottomR);
    }

    const again = await upload(original, 'copy.jpg');
    expect(again.status).toBe(409);
    expect(again.body.photoId).toBe(photo.id);
    expect(again.body.photo.id).toBe(photo.id);
  });

  it('lets its owner change alt text and caption while it is unpublished', async () => {
    const answer = await upload(await phoneJpeg(), 'second.jpg');
    const patched = await fetch(`${base}/api/v1/photos/${answer.body.photo.id}`, {
      method: 'PATCH',
      headers: { cookie: writer.cookie, origin: base, 'content-type': 'application/json' },
      body: JSON.stringify({ alt: 'Idler tyre, cracked', caption: '' }),
    });
    expect(patched.status).toBe(200);
    expect((await patched.json()).photo.alt).toBe('Idler tyre, cracked');
  });
});

describe('bad uploads', () => {
  let before: number;
  beforeAll(async () => {
    before = Number((await knex('photos').count('* as n').first())!.n);
  });

  it('refuses a HEIC photo with a message to convert it', async () => {
    const answer = await upload(heicHeader(), 'IMG_0043.HEIC');
    expect(answer.status).toBe(415);
    expect(answer.body.error.fields.file[0]).toMatch(/HEIC[\s\S]*Convert it to JPEG or PNG/);
  });

  it('refuses a zip archive renamed .jpg by what its bytes are', async () => {
    const answer = await upload(zipArchive(), 'holiday.jpg');
    expect(answer.status).toBe(415);
    expect(answer.body.error.fields.file[0]).toMatch(/ZIP/);
  });

  it('refuses a PNG signature followed by garbage as not an image', async () => {
    const answer = await upload(pngHeaderThenGarbage(), 'broken.png');
    expect(answer.status).toBe(415);
    expect(answer.body.error.fields.file[0]).toMatch(/does not look like an image/);
  });

  it('refuses a PNG whose header is valid but whose image data is garbage', async () => {
    const answer = await upload(pngWithGarbageData(), 'broken.png');
    expect(answer.status).toBe(400);
    expect(answer.body.error.fields.file[0]).toMatch(/damaged or cut off/);
  });

  it('refuses a truncated JPEG', async () => {
    const whole = await phoneJpeg();
    const answer = await upload(whole.subarray(0, Math.floor(whole.length * 0.6)), 'cut.jpg');
    expect(answer.status).toBe(400);
    expect(answer.body.error.fields.file[0]).toMatch(/damaged or cut off/);
  });

  it('refuses a 20,000 × 20,000 pixel image before decoding it', async () => {
    const answer = await upload(hugePng(), 'bomb.png');
    expect(answer.status).toBe(413);
    expect(answer.body.error.fields.file[0]).toMatch(/20000 × 20000 pixels/);
  });

  it('refuses a file over 12 MB, with or without a declared length', async () => {
    const big = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(13 * 1024 * 1024)]);
    const declared = await upload(big, 'big.jpg');
    expect(declared.status).toBe(413);
    const boundary = 'benchlore-test-boundary';
    const head = Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="alt"\r\n\r\nBig\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`,
    );
    const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(head);
        for (let i = 0; i < 14; i++) controller.enqueue(new Uint8Array(1024 * 1024));
        controller.enqueue(tail);
        controller.close();
      },
    });
    const chunked = await fetch(`${base}/api/v1/photos`, {
      method: 'POST',
      headers: { cookie: writer.cookie, origin: base, 'content-type': `multipart/form-data; boundary=${boundary}` },
      body: stream,
      duplex: 'half',
    } as RequestInit);
    expect(chunked.status).toBe(413);
  });

  it('asks for alt text, and for a signed-in, confirmed account', async () => {
    const noAlt = await upload(await phoneJpeg(), 'x.jpg', { alt: '  ' });
    expect(noAlt.status).toBe(400);
    expect(noAlt.body.error.fields.alt[0]).toMatch(/alt text/);
    const anonymous = await fetch(`${base}/api/v1/photos`, { method: 'POST', headers: { origin: base }, body: new FormData() });
    expect(anonymous.status).toBe(401);
    const unverified = await session(knex, base, 'member', 'photos-unverified', false);
    expect((await upload(await phoneJpeg(), 'x.jpg', undefined, unverified.cookie)).status).toBe(403);
  });

  it('stored nothing for any of them', async () => {
    expect(Number((await knex('photos').count('* as n').first())!.n)).toBe(before);
  });
});
