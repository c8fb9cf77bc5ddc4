// The one place sharp is created for uploads: pixel limit, no metadata kept, EXIF orientation applied, no cache.
import sharp from 'sharp';

// Every upload is a different image, so libvips' operation cache (up to 50 MB by default) only held on to decoded
// pixels after each photo was done: off. Renditions are made one after another, so one libvips thread per
// operation is enough and keeps fewer thread arenas of memory alive (a peak-RSS choice; see `npm run bench`).
sharp.cache(false);
sharp.concurrency(1);

/** About 40 megapixels: larger than any phone photo, small enough to refuse decompression bombs. */
export const MAX_INPUT_PIXELS = 40_000_000;

export function openImage(input: Buffer): ReturnType<typeof sharp> {
  // rotate() with no argument applies the EXIF orientation; output carries no metadata by default.
  return sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error', sequentialRead: true }).rotate();
}

/** Width and height as the photo will be shown (after its EXIF orientation), read from the header only; null if unreadable. */
export async function readImageHeader(input: Buffer): Promise<{ width: number; height: number } | null> {
  try {
    // The header is read without decoding pixels, so the pixel limit is checked by the caller, not here.
    const meta = await sharp(input, { limitInputPixels: false }).metadata();
    const width = meta.autoOrient?.width ?? meta.width;
    const height = meta.autoOrient?.height ?? meta.height;
    return width > 0 && height > 0 ? { width, height } : null;
  } catch {
    return null;
  }
}

/** Pixels already decoded and oriented (by `openImage(...).raw()`), opened again to make a smaller copy. */
export function openPixels(data: Buffer, info: { width: number; height: number; channels: 1 | 2 | 3 | 4 }): ReturnType<typeof sharp> {
  return sharp(data, { raw: { width: info.width, height: info.height, channels: info.channels } });
}
