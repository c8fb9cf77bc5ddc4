// GET /api/v1/handover-notes/:code/qr.png: the note's address as a QR code in PNG, for invoicing programs.
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
  const png = await QRCode.toBuffer(note.url, { type: 'png', errorCorrectionLevel: 'M', margin: 2, width: 480 });
  return new Response(new Uint8Array(png), {
    headers: {
      'Content-Type': 'image/png',
      'Content-Disposition': `inline; filename="hand-over-note-${note.code}.png"`,
      'Cache-Control': 'private, max-age=3600',
    },
  });
};
