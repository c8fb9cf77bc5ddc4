// The account's "what reaches you" form: one delivery per kind of news; kinds left out keep their setting.
import { z } from 'zod';
import { deliveries, notificationKinds, type NotificationKind } from '@/lib/notifications/kinds';

const delivery = z.enum(deliveries, {
  error: 'Choose e-mail at once, the weekly digest or only in Benchlore, for example now, digest or app.',
});

export const notificationSettingsSchema = z
  .object(
    Object.fromEntries(notificationKinds.map((kind) => [kind, delivery.optional()])) as Record<
      NotificationKind,
      z.ZodOptional<typeof delivery>
    >,
    { error: 'Send one choice per kind of news, for example fix_proofed=digest.' },
  )
  .strip();
export type NotificationSettingsInput = z.input<typeof notificationSettingsSchema>;
export type NotificationSettings = z.output<typeof notificationSettingsSchema>;
