// Following and the notification list as form Actions: plain HTML forms that work without JavaScript, on the
// shared form runner (permission checked again, everything typed kept, a refusal shown where it was sent).
import type { ActionAPIContext } from 'astro:actions';
import { followSchema } from '@/lib/schemas/follow';
import { notificationSettingsSchema } from '@/lib/schemas/notification-settings';
import { localPathOr } from '@/lib/local-path';
import { fieldErrors } from '@/server/http/responses';
import { runFormAction, type PageFormResult } from '@/server/http/forms';
import { refuse, succeed } from '@/server/http/result';
import { setFollowing } from '@/server/notifications/follows';
import { markRead } from '@/server/notifications/events';
import { saveDeliveries } from '@/server/notifications/settings';

type Context = Pick<ActionAPIContext, 'locals'>;

/** Follow or stop following; back to the page the button was on (the Following page says which way it went). */
export function submitFollowForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'follow', async (user, fields) => {
    const parsed = followSchema.safeParse(fields);
    if (!parsed.success) {
      // The form's fields are hidden: the reader sees what was wrong in the message itself.
      const messages = fieldErrors(parsed.error);
      return refuse(
        'bad_request',
        `Nothing was changed: ${Object.values(messages).flat()[0] ?? 'the form did not say what to follow.'}`,
        messages,
      );
    }
    const outcome = await setFollowing(user.id, parsed.data.kind, parsed.data.slug, parsed.data.follow === 'yes');
    if (!outcome.ok) return outcome;
    const back = localPathOr(parsed.data.back, outcome.value.target.path);
    return succeed({ location: back === '/following' ? `/following?${outcome.value.following ? 'followed' : 'stopped'}=1` : back });
  });
}

export function submitMarkReadForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'follow', async (user) => {
    const ids = form
      .getAll('id')
      .map((v) => Number(v))
      .filter((n) => Number.isSafeInteger(n) && n > 0);
    await markRead(user.id, ids.length ? ids : 'all');
    return succeed({ location: '/notifications?read=1' });
  });
}

export function submitNotificationSettingsForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'follow', async (user, fields) => {
    const parsed = notificationSettingsSchema.safeParse(fields);
    if (!parsed.success)
      return refuse('bad_request', 'Nothing was changed: choose one way for each kind of news.', fieldErrors(parsed.error));
    await saveDeliveries(user.id, parsed.data);
    return succeed({ location: '/account/notifications?saved=1' });
  });
}
