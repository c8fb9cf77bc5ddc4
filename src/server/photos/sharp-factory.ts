// The one place sharp is created for uploads: pixel limit, no metadata kept, EXIF orientation applied.
import sharp from 'sharp';

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
