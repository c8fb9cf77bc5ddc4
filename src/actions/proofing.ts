// The moderators' forms: the decision on /proofing/[id], and on the desk and a fix's history closing a report
// and locking or hiding a fix. A refusal renders on the page that posted it with the note as typed.
import type { ActionAPIContext } from 'astro:actions';
import { fixFlagSchema } from '@/lib/schemas/fix-flag';
import { resolutionSchema } from '@/lib/schemas/report-resolution';
import { slugSchema } from '@/lib/schemas/slug';
import { fieldErrors } from '@/lib/schemas/field-errors';
import { setFixFlag } from '@/server/fixes/locks';
import { closeReport } from '@/server/fixes/reports';
import { decideFromDesk } from '@/server/proofing/decisions';
import { idParam } from '@/server/http/endpoint';
import { runFormAction, type PageFormResult } from '@/server/http/forms';
import { refuse, succeed } from '@/server/http/result';

type Context = Pick<ActionAPIContext, 'locals'>;

/** A note and two buttons, proof or return; the revision is named in a hidden field. */
export function submitDecisionForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'proof', async (user, fields) => {
    const id = idParam(fields.revision);
    if (!id) return refuse('not_found', 'There is no such revision on the desk.');
    return decideFromDesk(user, id, fields);
  });
}

/** Lock, unlock, hide or unhide a fix, from the desk or from the fix's history (`from=history`). */
export function submitFixFlagForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'lock_fix', async (user, fields) => {
    const slug = slugSchema.safeParse(fields.fix);
    if (!slug.success) return refuse('not_found', 'There is no such fix.');
    const parsed = fixFlagSchema.safeParse({ action: fields.action, note: fields.note ?? '' });
    if (!parsed.success) {
      const errors = fieldErrors(parsed.error);
      const why = errors.note ? 'keep the note under 2000 characters' : 'choose lock, unlock, hide or unhide';
      return refuse('bad_request', `Nothing changed: ${why}.`, errors);
    }
    const outcome = await setFixFlag(user, slug.data, parsed.data);
    if (!outcome.ok) return outcome;
    const [page, anchor] = fields.from === 'history' ? [`/fixes/${slug.data}/history`, '#moderation'] : ['/proofing', '#fixes'];
    return succeed({ location: `${page}?fix=${parsed.data.action}${anchor}` });
  });
}

/** Resolve or dismiss a member's report on a fix, with an optional note. */
export function submitReportResolutionForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'moderate', async (user, fields) => {
    const id = idParam(fields.report);
    if (!id) return refuse('not_found', 'There is no such report.');
    const parsed = resolutionSchema.safeParse({ outcome: fields.outcome, note: fields.note ?? '' });
    if (!parsed.success) {
      const errors = fieldErrors(parsed.error);
      const why = errors.note ? 'keep the note under 2000 characters' : 'choose to resolve or dismiss it';
      return refuse('bad_request', `The report stays open: ${why}.`, errors);
    }
    const outcome = await closeReport(user, id, parsed.data);
    return outcome.ok ? succeed({ location: '/proofing?report=closed#reports' }) : outcome;
  });
}
