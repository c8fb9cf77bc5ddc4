// Photo pipeline figures: a 12-megapixel JPEG uploaded by a signed-in member, the time until the upload is
// answered, the time until every rendition is ready, and the server's peak resident memory meanwhile.
import sharp from 'sharp';
import { rssMb } from './server.ts';

export interface PhotoFigures {
  megapixels: number;
  uploadBytes: number;
  answeredMs: number;
  readyMs: number;
  peakRssMb: number;
  idleRssMb: number;
}

/** A photo-like 4000 × 3000 JPEG: blurred noise compresses like a real bench photo, not like a flat colour. */
async function twelveMegapixelJpeg(): Promise<Buffer> {
  return sharp({
    create: { width: 4000, height: 3000, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 40 } },
  })
    .blur(1.2)
    .jpeg({ quality: 88 })
    .toBuffer();
}

export async function benchPhoto(base: string, cookie: string, serverPid: number): Promise<PhotoFigures> {
  const jpeg = await twelveMegapixelJpeg();
  const idleRssMb = await rssMb(serverPid);
  let peakRssMb = idleRssMb;
  let sampling = true;
  const sampler = (async () => {
    while (sampling) {
      peakRssMb = Math.max(peakRssMb, await rssMb(serverPid));
      await new Promise((r) => setTimeout(r, 25));
    }
  })();
  try {
    const form = new FormData();
    form.set('file', new Blob([new Uint8Array(jpeg)], { type: 'image/jpeg' }), 'bench.jpg');
    form.set('alt', 'A synthetic 12-megapixel photo for the benchmark.');
    const started = performance.now();
    const res = await fetch(`${base}/api/v1/photos`, { method: 'POST', body: form, headers: { cookie, origin: base } });
    const answeredMs = performance.now() - started;
    const body = (await res.json()) as { photo?: { id: number }; error?: { message: string } };
    if (res.status !== 202 || !body.photo) throw new Error(`The upload answered ${res.status}: ${body.error?.message ?? ''}`);
    const deadline = Date.now() + 60_000;
    let readyMs = 0;
    for (;;) {
      const state = (await (await fetch(`${base}/api/v1/photos/${body.photo.id}`, { headers: { cookie } })).json()) as {
        photo?: { state: string };
      };
      if (state.photo?.state === 'ready') {
        readyMs = performance.now() - started;
        break;
      }
      if (state.photo?.state === 'failed') throw new Error('The photo failed to process');
      if (Date.now() > deadline) throw new Error('The renditions were not ready within 60 s');
      await new Promise((r) => setTimeout(r, 50));
    }
    return { megapixels: 12, uploadBytes: jpeg.length, answeredMs, readyMs, peakRssMb, idleRssMb };
  } finally {
    sampling = false;
    await sampler;
  }
}

export function photoTable(f: PhotoFigures): string {
  const mark = (ok: boolean) => (ok ? 'met' : 'not met');
  return [
    `Photo pipeline (one ${f.megapixels}-megapixel JPEG of ${(f.uploadBytes / 1_048_576).toFixed(1)} MB)`,
    `  upload answered      ${f.answeredMs.toFixed(0).padStart(6)} ms   goal ≤ 1000 ms: ${mark(f.answeredMs <= 1000)}`,
    `  renditions ready     ${f.readyMs.toFixed(0).padStart(6)} ms   goal ≤ 3000 ms: ${mark(f.readyMs <= 3000)}`,
    `  server peak RSS      ${f.peakRssMb.toFixed(0).padStart(6)} MB   goal ≤ 350 MB: ${mark(f.peakRssMb <= 350)} (idle ${f.idleRssMb.toFixed(0)} MB)`,
  ].join('\n');
}
