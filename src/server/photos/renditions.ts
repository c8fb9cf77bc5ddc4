// Responsive renditions of a photo: a few widths, WebP with a JPEG fallback.
import { openImage } from './sharp-factory';

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

export async function makeRenditions(
  input: Buffer,
  keyPrefix: string,
): Promise<{ width: number; height: number; renditions: RenditionOutput[] }> {
  const meta = await openImage(input).toBuffer({ resolveWithObject: true });
  const { width, height } = meta.info;
  const renditions: RenditionOutput[] = [];
  for (const w of widthsFor(width)) {
    for (const format of ['webp', 'jpeg'] as const) {
      const pipeline = openImage(input).resize({ width: w, withoutEnlargement: true });
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
  return { width, height, renditions };
}
