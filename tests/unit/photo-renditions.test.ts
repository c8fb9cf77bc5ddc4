// Renditions from one decode: the widths and formats, the EXIF orientation applied, 16-bit and alpha inputs, and the
// sharp settings that keep memory down (no operation cache, one thread per operation).
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import '@/server/photos/sharp-factory';
import { makeRenditions } from '@/server/photos/renditions';

const photo = (width: number, height: number) =>
  sharp({ create: { width, height, channels: 3, background: '#7a6a58', noise: { type: 'gaussian', mean: 120, sigma: 30 } } });

describe('makeRenditions', () => {
  it('makes WebP and JPEG at 480, 960 and 1600 px from a 2000 × 1500 photo, each the size it says', async () => {
    const input = await photo(2000, 1500).jpeg({ quality: 85 }).toBuffer();
    const made = await makeRenditions(input, 'photos/ab/test-1');
    expect({ width: made.width, height: made.height }).toEqual({ width: 2000, height: 1500 });
    expect(made.renditions.map((r) => `${r.format}@${r.width}x${r.height}`)).toEqual([
      'webp@480x360',
      'jpeg@480x360',
      'webp@960x720',
      'jpeg@960x720',
      'webp@1600x1200',
      'jpeg@1600x1200',
    ]);
    for (const r of made.renditions) {
      const meta = await sharp(r.body).metadata();
      expect([meta.format, meta.width, meta.height, r.bytes]).toEqual([r.format, r.width, r.height, r.body.length]);
      expect(meta.exif).toBeUndefined();
    }
  }, 30_000);

  it('applies the EXIF orientation (6: rotate 90°) so a portrait photo comes out portrait', async () => {
    const input = await photo(1200, 800).jpeg().withMetadata({ orientation: 6 }).toBuffer();
    const made = await makeRenditions(input, 'photos/ab/test-2');
    expect({ width: made.width, height: made.height }).toEqual({ width: 800, height: 1200 });
    expect(made.renditions.map((r) => `${r.width}x${r.height}`)).toEqual(['480x720', '480x720']);
  }, 30_000);

  it('reads a 16-bit PNG with alpha into 8-bit renditions', async () => {
    const input = await sharp({ create: { width: 600, height: 400, channels: 4, background: { r: 10, g: 120, b: 90, alpha: 0.5 } } })
      .png()
      .toColourspace('rgb16')
      .toBuffer();
    const made = await makeRenditions(input, 'photos/ab/test-3');
    expect(made.renditions.map((r) => `${r.format}@${r.width}`)).toEqual(['webp@480', 'jpeg@480']);
    expect((await sharp(made.renditions[1]!.body).metadata()).depth).toBe('uchar');
  }, 30_000);
});

describe('sharp for uploads', () => {
  it('keeps no operation cache and uses one thread per operation', () => {
    expect(sharp.cache()).toMatchObject({ memory: { max: 0 }, items: { max: 0 } });
    expect(sharp.concurrency()).toBe(1);
  });
});
