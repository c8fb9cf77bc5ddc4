// Hostile uploads against the built server: each one refused with a clear message or cleaned, nothing half stored, and
// no file left behind in the photo store or the photos tables.
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { testDb } from '../support/db';
import { INTEGRATION_PORT, testEnv } from '../support/test-env';
import { session, type Session } from '../fixtures/writing';
import { hasGpsPointer, hugePng, metadataBlocks, phoneJpeg } from '../fixtures/photo-files';
import { htmlNamedJpg, polyglotJpeg, scriptedSvg, slowHalfUpload } from '../fixtures/hostile-files';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const mediaDir = testEnv().BENCHLORE_MEDIA_DIR!;
const knex = testDb();
let writer: Session;

/** Every file in the photo store, with its size, so a file left behind (or half written) shows up. */
function storedFiles(dir = mediaDir): string[] {
  let entries;
  try {
    entries = readdirSync(dir, { withFileTypes: true });
  } catch {
    return [];
  }
  return entries.flatMap((e) =>
    e.isDirectory() ? storedFiles(join(dir, e.name)) : [`${join(dir, e.name)} ${statSync(join(dir, e.name)).size}`],
  );
}

async function rowCounts() {
  const count = async (table: string) => Number((await knex(table).count('* as n').first())!.n);
  return { photos: await count('photos'), uploads: await count('photo_uploads') };
}

async function upload(file: Buffer, name: string, type = 'application/octet-stream') {
  const form = new FormData();
  form.append('alt', 'The idler tyre seen from above');
  form.append('caption', 'Before cleaning');
  form.append('file', new Blob([new Uint8Array(file)], { type }), name);
  const response = await fetch(`${base}/api/v1/photos`, { method: 'POST', headers: { cookie: writer.cookie, origin: base }, body: form });
  return { status: response.status, body: await response.json() };
}

async function waitReady(id: number) {
  for (let i = 0; i < 120; i++) {
    const body = await (await fetch(`${base}/api/v1/photos/${id}`, { headers: { cookie: writer.cookie } })).json();
    if (body.photo.state !== 'pending') return body.photo;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error('photo still pending');
}

beforeAll(async () => {
  writer = await session(knex, base, 'member', 'hostile-uploads');
});
afterAll(() => knex.destroy());

describe('hostile uploads', () => {
  const answers: Record<string, number> = {};
  let filesBefore: string[];
  let rowsBefore: { photos: number; uploads: number };

  beforeAll(async () => {
    filesBefore = storedFiles();
    rowsBefore = await rowCounts();
  });

  it('refuses an SVG carrying a script, whatever it is called', async () => {
    for (const [name, type] of [
      ['diagram.svg', 'image/svg+xml'],
      ['diagram.jpg', 'image/jpeg'],
    ] as const) {
      const answer = await upload(scriptedSvg(), name, type);
      answers[`SVG with script as ${name}`] = answer.status;
      expect(answer.status).toBe(415);
      // Its bytes read as XML: refused by what it is, with the kinds we take.
      expect(answer.body.error.fields.file[0]).toMatch(/(XML|does not look like an image)[\s\S]*JPEG, PNG, WebP or AVIF/);
    }
  });

  it('refuses an HTML page named .jpg by what its bytes are', async () => {
    const answer = await upload(htmlNamedJpg(), 'photo.jpg', 'image/jpeg');
    answers['HTML named .jpg'] = answer.status;
    expect(answer.status).toBe(415);
    expect(answer.body.error.fields.file[0]).toMatch(/does not look like an image/);
  });

  it('refuses a truncated JPEG as damaged', async () => {
    const whole = await phoneJpeg();
    const answer = await upload(whole.subarray(0, Math.floor(whole.length / 2)), 'cut.jpg', 'image/jpeg');
    answers['truncated JPEG'] = answer.status;
    expect(answer.status).toBe(400);
    expect(answer.body.error.fields.file[0]).toMatch(/damaged or cut off[\s\S]*Save it again as JPEG or PNG/);
  });

  it('refuses a decompression bomb (a few bytes claiming 20,000 × 20,000 pixels) before decoding it', async () => {
    const bomb = hugePng();
    expect(bomb.length).toBeLessThan(200);
    const answer = await upload(bomb, 'bomb.png', 'image/png');
    answers['decompression bomb'] = answer.status;
    expect(answer.status).toBe(413);
    expect(answer.body.error.fields.file[0]).toMatch(/Scale it down/);
  });

  it('refuses a zero-byte file with a sentence saying what to send', async () => {
    const answer = await upload(Buffer.alloc(0), 'empty.jpg', 'image/jpeg');
    answers['zero-byte file'] = answer.status;
    expect([400, 415]).toContain(answer.status);
    expect(JSON.stringify(answer.body.error)).toMatch(/JPEG|photo/);
  });

  it('stores nothing from an upload that stops half way, and keeps serving', async () => {
    const outcome = await slowHalfUpload(base, writer.cookie, await phoneJpeg());
    answers['slow upload stopped half way'] = outcome.status ?? 0;
    // The client gave up: the server either never answered or answered with a refusal, never a success.
    if (outcome.status !== undefined) expect(outcome.status).toBeGreaterThanOrEqual(400);
    await new Promise((r) => setTimeout(r, 500));
    expect((await fetch(`${base}/machines`)).status).toBe(200);
  });

  it('left no row and no file behind for any of them', async () => {
    expect(await rowCounts()).toEqual(rowsBefore);
    expect(storedFiles()).toEqual(filesBefore);
    console.info(`hostile uploads answered: ${JSON.stringify(answers)}`);
  });

  it('cleans a polyglot (a JPEG with a page and a script appended): only re-encoded pixels are ever served', async () => {
    const { file, marker } = await polyglotJpeg();
    const answer = await upload(file, 'innocent.jpg', 'image/jpeg');
    expect(answer.status).toBe(202);
    const photo = await waitReady(answer.body.photo.id);
    expect(photo.state).toBe('ready');
    const row = await knex('photos').where({ id: photo.id }).first();
    expect(await knex('photo_uploads').where({ photo_id: photo.id }).first()).toBeUndefined();
    for (const rendition of row.renditions as { key: string; format: string }[]) {
      const served = await fetch(`${base}/media/${rendition.key}`);
      expect(served.headers.get('content-type')).toMatch(/^image\/(jpeg|webp)$/);
      expect(served.headers.get('x-content-type-options')).toBe('nosniff');
      const bytes = Buffer.from(await served.arrayBuffer());
      expect(bytes.includes(Buffer.from(marker))).toBe(false);
      expect(bytes.includes(Buffer.from('<script'))).toBe(false);
    }
  });

  it('cleans a JPEG with GPS in its EXIF: the served photo has no GPS and no EXIF at all', async () => {
    const original = await phoneJpeg();
    expect(hasGpsPointer((await sharp(original).metadata()).exif)).toBe(true);
    expect(metadataBlocks(original)).toContain('Exif');
    const answer = await upload(original, 'IMG_2201.JPG', 'image/jpeg');
    expect(answer.status).toBe(202);
    const photo = await waitReady(answer.body.photo.id);
    const row = await knex('photos').where({ id: photo.id }).first();
    for (const rendition of row.renditions as { key: string }[]) {
      const bytes = Buffer.from(await (await fetch(`${base}/media/${rendition.key}`)).arrayBuffer());
      const meta = await sharp(bytes).metadata();
      expect(meta.exif).toBeUndefined();
      // Read by structure: searching compressed pixels for the GPS tag's two bytes finds them by chance.
      expect(metadataBlocks(bytes)).toEqual([]);
    }
  });
});
