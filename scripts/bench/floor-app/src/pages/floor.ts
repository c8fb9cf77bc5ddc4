// Returns the bytes the benchmark captured from the app's fix page, read once at start-up.
import { readFileSync } from 'node:fs';
import type { APIRoute } from 'astro';

const body = readFileSync(process.env.BENCH_BYTES_FILE ?? '', 'utf8');

export const GET: APIRoute = () => new Response(body, { headers: { 'Content-Type': 'text/html; charset=utf-8' } });
