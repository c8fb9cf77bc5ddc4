// POST /api/v1/drafts: starts the writer's draft of a new fix, or of a live fix (`fixSlug`) on top of its live revision.
import type { APIRoute } from 'astro';
import { draftCreateBodySchema as bodySchema } from '@/server/openapi/inputs';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors } from '@/server/http/responses';
import { db } from '@/server/core/db';
import { createDraft } from '@/server/writing/drafts';
import { answer, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { respond } from '@/server/http/result';

export const POST: APIRoute = async ({ request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  if (!can(user, 'write_fix')) return apiError('forbidden', 'Confirm your e-mail address to write fixes.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  const body = bodySchema.safeParse(input.data);
  if (!body.success) return apiError('bad_request', 'The request is not valid.', fieldErrors(body.error));
  let fixId: number | null = null;
  if (body.data.fixSlug) {
    const fix = await db()('fixes').where({ slug: body.data.fixSlug }).whereNull('deleted_at').first('id');
    if (!fix) return apiError('not_found', 'There is no such fix to edit.');
    fixId = fix.id;
  }
  return answer(await createDraft(user, { fixId, values: body.data.values }), { kind: 'json' }, { status: 201, back: '/write' });
};
