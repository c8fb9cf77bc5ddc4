// The one place sharp is created for uploads: pixel limit, no metadata kept, EXIF orientation applied.
import sharp, { type Sharp } from 'sharp';

/** About 40 megapixels: larger than any phone photo, small enough to refuse decompression bombs. */
export const MAX_INPUT_PIXELS = 40_000_000;

export function openImage(input: Buffer): Sharp {
  // rotate() with no argument applies the EXIF orientation; output carries no metadata by default.
  return sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error', sequentialRead: true }).rotate();
}
