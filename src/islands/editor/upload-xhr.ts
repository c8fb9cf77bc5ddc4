// Uploads one photo with XMLHttpRequest (for upload progress), then polls until its renditions are made.
import { callApi, type ApiResult } from './api';
import type { PhotoRefData } from '../../lib/writing/editor-data';

export const MAX_PHOTO_BYTES = 12 * 1024 * 1024;
export const acceptedTypes = ['image/jpeg', 'image/png', 'image/webp', 'image/avif'];

/** A check before sending anything; the server sniffs the bytes and decides for real. */
export function precheckPhoto(file: File): string | null {
  if (file.size > MAX_PHOTO_BYTES)
    return `This file is ${(file.size / 1024 / 1024).toFixed(1)} MB; the largest we take is 12 MB. Save it smaller and try again.`;
  if (/hei[cf]$/i.test(file.type) || /\.(heic|heif)$/i.test(file.name))
    return 'HEIC/HEIF photos cannot be used yet: convert it to JPEG or PNG first.';
  if (file.type && !acceptedTypes.includes(file.type)) return `This is ${file.type}, not a photo we take: use JPEG, PNG, WebP or AVIF.`;
  return null;
}

export type UploadAnswer = { photo: PhotoRefData } | { duplicateOf: number; photo: PhotoRefData | null; message: string };

export function uploadPhoto(
  file: File,
  text: { alt: string; caption: string },
  onProgress: (fraction: number) => void,
): Promise<ApiResult<UploadAnswer>> {
  return new Promise((resolve) => {
    const body = new FormData();
    // Text first, file last: the server reads the fields before the bytes arrive.
    body.append('alt', text.alt);
    body.append('caption', text.caption);
    body.append('file', file, file.name);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/v1/photos');
    xhr.responseType = 'json';
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onerror = () =>
      resolve({ ok: false, failure: { status: 0, code: 'network', message: 'the upload was cut off (offline?)', fields: {}, extra: {} } });
    xhr.onload = () => {
      const data = (xhr.response ?? {}) as {
        photo?: PhotoRefData;
        photoId?: number;
        error?: { code: string; message: string; fields?: Record<string, string[]> };
      };
      if (xhr.status === 202 && data.photo) return resolve({ ok: true, data: { photo: data.photo } });
      if (xhr.status === 409 && typeof data.photoId === 'number') {
        return resolve({
          ok: true,
          data: { duplicateOf: data.photoId, photo: data.photo ?? null, message: data.error?.message ?? 'This photo was uploaded before.' },
        });
      }
      const fields = data.error?.fields ?? {};
      resolve({
        ok: false,
        failure: {
          status: xhr.status,
          code: data.error?.code ?? 'internal',
          message: fields.file?.[0] ?? data.error?.message ?? `the server answered ${xhr.status}`,
          fields,
          extra: {},
        },
      });
    };
    xhr.send(body);
  });
}

/** Polls the photo until its renditions exist or fail, up to about two minutes. */
export async function waitForPhoto(photoId: number, signal: { cancelled: boolean }): Promise<ApiResult<{ photo: PhotoRefData }>> {
  for (let attempt = 0; attempt < 120 && !signal.cancelled; attempt++) {
    const result = await callApi<{ photo: PhotoRefData }>(`/api/v1/photos/${photoId}`, { method: 'GET' });
    if (!result.ok || result.data.photo.state !== 'pending') return result;
    await new Promise((r) => setTimeout(r, attempt < 10 ? 700 : 2000));
  }
  return {
    ok: false,
    failure: {
      status: 0,
      code: 'timeout',
      message: 'the photo is taking long to process; save the draft and look again later',
      fields: {},
      extra: {},
    },
  };
}
