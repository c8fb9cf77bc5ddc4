// Following and the notification list as form Actions: plain HTML forms that work without JavaScript.
import type { ActionAPIContext } from 'astro:actions';
import { can } from '@/lib/permissions';
import { followSchema } from '@/lib/schemas/follow';
import { notificationSettingsSchema } from '@/lib/schemas/notification-settings';
import { fieldErrors } from '@/server/http/responses';
import { setFollowing } from '@/server/notifications/follows';
import { markRead } from '@/server/notifications/events';
import { saveDeliveries } from '@/server/notifications/settings';
import { localPathOr } from '@/lib/local-path';
import { typedFields, type FormActionResult } from '@/lib/form-fields';

type Context = Pick<ActionAPIContext, 'locals'>;

export type FollowFormResult = FormActionResult<{ following: boolean; name: string; back: string }>;

export async function submitFollowForm(form: FormData, { locals }: Context): Promise<FollowFormResult> {
  const typed = typedFields(form, ['kind', 'slug', 'follow', 'back']);
  const refuse = (status: number, message: string, fields: Record<string, string[]> = {}): FollowFormResult => ({
    saved: false,
    status,
    message,
    fields,
    typed,
  });
  const user = locals.user;
  if (!user) return refuse(401, 'Sign in to follow machines, chassis families, makers and fixes.');
  if (!can(user, 'follow')) return refuse(403, 'Your account may not follow anything at the moment.');
  const parsed = followSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success) {
    // The form's fields are hidden: the reader sees what was wrong in the message itself.
    const fields = fieldErrors(parsed.error);
    return refuse(400, `Nothing was changed: ${Object.values(fields).flat()[0] ?? 'the form did not say what to follow.'}`, fields);
  }
  const outcome = await setFollowing(user.id, parsed.data.kind, parsed.data.slug, parsed.data.follow === 'yes');
  if (!outcome.ok) return refuse(outcome.code === 'not_found' ? 404 : 400, outcome.message);
  return {
    saved: true,
    following: outcome.value.following,
    name: outcome.value.target.name,
    back: localPathOr(parsed.data.back, outcome.value.target.path),
  };
}

export type MarkReadResult = FormActionResult<{ marked: number }>;

export async function submitMarkReadForm(form: FormData, { locals }: Context): Promise<MarkReadResult> {
  const user = locals.user;
  const typed = typedFields(form, ['id']);
  if (!user || !can(user, 'follow')) return { saved: false, status: 401, message: 'Sign in to see your notifications.', fields: {}, typed };
  const ids = form
    .getAll('id')
    .map((v) => Number(v))
    .filter((n) => Number.isSafeInteger(n) && n > 0);
  const marked = await markRead(user.id, ids.length ? ids : 'all');
  return { saved: true, marked };
}

export type NotificationSettingsResult = FormActionResult<Record<never, never>>;

export async function submitNotificationSettingsForm(form: FormData, { locals }: Context): Promise<NotificationSettingsResult> {
  const user = locals.user;
  const typed = typedFields(form, [...form.keys()]);
  if (!user || !can(user, 'follow'))
    return { saved: false, status: 401, message: 'Sign in to choose what reaches you.', fields: {}, typed };
  const parsed = notificationSettingsSchema.safeParse(Object.fromEntries(form));
  if (!parsed.success)
    return {
      saved: false,
      status: 400,
      message: 'Nothing was changed: choose one way for each kind of news.',
      fields: fieldErrors(parsed.error),
      typed,
    };
  await saveDeliveries(user.id, parsed.data);
  return { saved: true };
}
