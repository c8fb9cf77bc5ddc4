// GET /api/v1/handover-notes/:code/qr.svg: the note's address as a QR code in SVG, for its owner to print.
import type { APIRoute } from 'astro';
import QRCode from 'qrcode';
import { can } from '@/lib/permissions';
import { apiError } from '@/server/http/responses';
import { getOwnNote } from '@/server/bench-work/handover-notes';

export const GET: APIRoute = async ({ locals, params }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to get the QR code of your note.');
  if (!can(user, 'write_handover_note')) return apiError('forbidden', 'Your account may not write notes.');
  const note = await getOwnNote(user.id, params.code ?? '');
  if (!note) return apiError('not_found', 'You have no hand-over note with that code.');
  // Level M survives a smudge on a printed invoice (about 15 % of the symbol, ISO/IEC 18004).
  const svg = await QRCode.toString(note.url, { type: 'svg', errorCorrectionLevel: 'M', margin: 2 });
  return new Response(svg, { headers: { 'Content-Type': 'image/svg+xml; charset=utf-8', 'Cache-Control': 'private, max-age=3600' } });
};
