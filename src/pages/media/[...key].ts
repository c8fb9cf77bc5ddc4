// Serves stored photo renditions; keys are content-addressed, so they may be cached for good.
import type { APIRoute } from 'astro';
import { storage } from '@/server/storage';
import { storageKeyPattern } from '@/server/storage/storage-driver';

export const GET: APIRoute = async ({ params }) => {
  const key = params.key ?? '';
  if (!storageKeyPattern.test(key) || key.includes('..') || key.endsWith('-source.png')) {
    return new Response('Not found', { status: 404 });
  }
  const object = await storage().get(key);
  if (!object) return new Response('Not found', { status: 404 });
  return new Response(new Uint8Array(object.body), {
    headers: {
      'Content-Type': object.contentType,
      'Content-Length': String(object.body.length),
      'Cache-Control': 'public, max-age=31536000, immutable',
      'X-Content-Type-Options': 'nosniff',
    },
  });
};
