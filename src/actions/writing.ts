// A writer's own revisions from /write/mine and the proofing page: amend, withdraw, discard a draft. Each form
// names its revision in a hidden field; a refusal renders on the page that posted it.
import type { ActionAPIContext } from 'astro:actions';
import { idParam } from '@/server/http/endpoint';
import { runFormAction, type PageFormResult } from '@/server/http/forms';
import { refuse, succeed } from '@/server/http/result';
import { discardDraft } from '@/server/writing/drafts';
import { amendRevision, withdrawRevision } from '@/server/writing/submit';
import { editorPath } from '@/server/writing/paths';

type Context = Pick<ActionAPIContext, 'locals'>;
const noSuchRevision = refuse('not_found', 'There is no such revision among yours.');

/** Amending opens the editor on a new draft that continues the revision. */
export function submitAmendForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'write_fix', async (user, fields) => {
    const id = idParam(fields.revision);
    if (!id) return noSuchRevision;
    const outcome = await amendRevision(user, id);
    return outcome.ok ? succeed({ location: editorPath(outcome.value.revision) }) : outcome;
  });
}

export function submitWithdrawForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'write_fix', async (user, fields) => {
    const id = idParam(fields.revision);
    if (!id) return noSuchRevision;
    const outcome = await withdrawRevision(user, id);
    return outcome.ok ? succeed({ location: '/write/mine?withdrawn=1' }) : outcome;
  });
}

export function submitDiscardForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'write_fix', async (user, fields) => {
    const id = idParam(fields.revision);
    if (!id) return refuse('not_found', 'There is no such draft among yours.');
    const outcome = await discardDraft(user, id);
    return outcome.ok ? succeed({ location: '/write/mine?discarded=1' }) : outcome;
  });
}
