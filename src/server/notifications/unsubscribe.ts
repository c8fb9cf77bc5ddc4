// Acting on a signed unsubscribe link: stop one follow, one kind of mail, or the digest; no sign-in needed.
import { config } from '../core/config';
import { db } from '../core/db';
import { refuse, succeed, type Outcome } from '../http/result';
import { stopMailFor } from './settings';
import { notificationKinds, kindDescriptions, type NotificationKind } from '@/lib/notifications/kinds';
import { verifyUnsubscribe, type UnsubscribeClaim } from '@/lib/notifications/unsubscribe-token';

export interface StopDescription {
  claim: UnsubscribeClaim;
  /** What the page says will stop (or has stopped). */
  what: string;
}

const digestKinds = notificationKinds;

export async function describeUnsubscribe(token: string): Promise<Outcome<StopDescription>> {
  const secret = config().AUTH_SECRET;
  const claim = secret ? verifyUnsubscribe(secret, token) : null;
  if (!claim)
    return refuse(
      'not_found',
      'This unsubscribe link is not one of ours, or it was cut short. Copy the whole link from the mail, or choose what reaches you on your account page.',
    );
  const knex = db();
  const user = await knex('users').where({ id: claim.userId }).whereNull('deleted_at').first('id');
  if (!user) return refuse('not_found', 'The account this link was sent to no longer exists; nothing more will be sent to it.');
  if ('follow' in claim.what) {
    const follow = await knex('follows').where({ id: claim.what.follow, user_id: claim.userId }).first('target_kind');
    return succeed({
      claim,
      what: follow ? 'mail about this thing you follow: you will stop following it' : 'a follow you already stopped',
    });
  }
  if ('kind' in claim.what) {
    const kind = claim.what.kind as NotificationKind;
    if (!notificationKinds.includes(kind)) return refuse('not_found', 'This unsubscribe link names a kind of mail we no longer send.');
    return succeed({ claim, what: `e-mails for “${kindDescriptions[kind].label.toLowerCase()}” (they stay in your notification list)` });
  }
  return succeed({ claim, what: 'the weekly digest (news stays in your notification list)' });
}

/** Stops what the link names. Idempotent: the second click finds nothing left to stop and still says done. */
export async function applyUnsubscribe(token: string): Promise<Outcome<StopDescription>> {
  const described = await describeUnsubscribe(token);
  if (!described.ok) return described;
  const { claim } = described.value;
  const knex = db();
  if ('follow' in claim.what) await knex('follows').where({ id: claim.what.follow, user_id: claim.userId }).delete();
  else if ('kind' in claim.what) await stopMailFor(claim.userId, [claim.what.kind as NotificationKind], knex);
  else {
    const settings = await knex('notification_settings')
      .where({ user_id: claim.userId })
      .select<{ kind: NotificationKind; delivery: string }[]>('kind', 'delivery');
    const chosen = new Map(settings.map((s) => [s.kind, s.delivery]));
    // Kinds that went to the digest (chosen or by default) now stay in the app only.
    const toStop = digestKinds.filter((k) => (chosen.get(k) ?? kindDescriptions[k].fallback) === 'digest');
    await stopMailFor(claim.userId, toStop, knex);
  }
  return described;
}
