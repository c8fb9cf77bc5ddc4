// Responsive renditions of a photo: a few widths, WebP with a JPEG fallback.
import { openImage, openPixels, readImageHeader } from './sharp-factory';

export const RENDITION_WIDTHS = [480, 960, 1600] as const;

export interface Rendition {
  width: number;
  height: number;
  format: 'webp' | 'jpeg';
  key: string;
  bytes: number;
}

export interface RenditionOutput extends Rendition {
  body: Buffer;
}

/** Widths not larger than the original; the original width itself when it is smaller than them all. */
export function widthsFor(originalWidth: number): number[] {
  const widths = RENDITION_WIDTHS.filter((w) => w <= originalWidth);
  return widths.length > 0 ? widths : [originalWidth];
}

/**
 * Decodes the upload once, straight to the largest rendition's size (JPEG shrink-on-load keeps a 12-megapixel photo
 * from ever being held at full size more than once), then makes every width and format from those pixels.
 */
export async function makeRenditions(
  input: Buffer,
  keyPrefix: string,
): Promise<{ width: number; height: number; renditions: RenditionOutput[] }> {
  const header = await readImageHeader(input);
  if (!header) throw new Error('the image header could not be read');
  const widths = widthsFor(header.width);
  const largest = Math.max(...widths);
  const pixels = await openImage(input)
    .resize({ width: largest, withoutEnlargement: true })
    .toColourspace('srgb')
    .raw({ depth: 'uchar' })
    .toBuffer({ resolveWithObject: true });
  const info = { width: pixels.info.width, height: pixels.info.height, channels: pixels.info.channels };
  const renditions: RenditionOutput[] = [];
  for (const w of widths) {
    for (const format of ['webp', 'jpeg'] as const) {
      const pipeline = openPixels(pixels.data, info).resize({ width: w, withoutEnlargement: true });
      const out = await (format === 'webp' ? pipeline.webp({ quality: 80 }) : pipeline.jpeg({ quality: 82, mozjpeg: true })).toBuffer({
        resolveWithObject: true,
      });
      const ext = format === 'webp' ? 'webp' : 'jpg';
      renditions.push({
        width: out.info.width,
        height: out.info.height,
        format,
        key: `${keyPrefix}-${w}.${ext}`,
        bytes: out.info.size,
        body: out.data,
      });
    }
  }
  return { width: header.width, height: header.height, renditions };
}
