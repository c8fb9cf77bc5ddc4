// What a member can be told about, how each kind may reach them, and what they follow. Pure: the account
// settings form, the notification list and the mail builders all read these.

export const followTargetKinds = ['machine', 'chassis', 'maker', 'fix'] as const;
export type FollowTargetKind = (typeof followTargetKinds)[number];

export const followTargetLabels: Record<FollowTargetKind, string> = {
  machine: 'machine',
  chassis: 'chassis family',
  maker: 'maker',
  fix: 'fix',
};

export const notificationKinds = ['fix_proofed', 'bench_report', 'fault_came_back', 'handover_revised', 'moderator_reply'] as const;
export type NotificationKind = (typeof notificationKinds)[number];

export const deliveries = ['now', 'digest', 'app'] as const;
export type Delivery = (typeof deliveries)[number];

export const deliveryLabels: Record<Delivery, string> = {
  now: 'E-mail at once',
  digest: 'In the weekly digest',
  app: 'Only here in Benchlore',
};

export interface KindDescription {
  /** The settings form's label: what the member hears about. */
  label: string;
  /** Where it comes from, for the settings page. */
  hint: string;
  /** What a member who never chose gets. */
  fallback: Delivery;
}

export const kindDescriptions: Record<NotificationKind, KindDescription> = {
  fix_proofed: {
    label: 'A fix goes live for something you follow',
    hint: 'A new fix or a new proofed revision for a machine, chassis family, maker or fix you follow.',
    fallback: 'digest',
  },
  bench_report: {
    label: 'A bench report on a fix you wrote',
    hint: 'Someone followed your fix on the bench and said how it went.',
    fallback: 'digest',
  },
  fault_came_back: {
    label: 'The fault came back after your fix',
    hint: 'A bench report saying the repair did not hold: worth a look at once.',
    fallback: 'now',
  },
  handover_revised: {
    label: 'A fix in one of your hand-over notes was revised',
    hint: 'So you can decide whether to tell the customer.',
    fallback: 'now',
  },
  moderator_reply: {
    label: 'A moderator answers your revision',
    hint: 'A note from the proofing desk on a revision you wrote.',
    fallback: 'now',
  },
};

/** The member's choice per kind, with the fallback for kinds they never set. */
export function effectiveDeliveries(chosen: Partial<Record<NotificationKind, Delivery>>): Record<NotificationKind, Delivery> {
  return Object.fromEntries(notificationKinds.map((kind) => [kind, chosen[kind] ?? kindDescriptions[kind].fallback])) as Record<
    NotificationKind,
    Delivery
  >;
}

/**
 * The Monday (UTC) that starts the week holding `at`: digests cover Monday 00:00 to the next Monday 00:00 UTC.
 * ISO 8601 weeks start on Monday.
 */
export function weekStart(at: Date): Date {
  const day = new Date(Date.UTC(at.getUTCFullYear(), at.getUTCMonth(), at.getUTCDate()));
  const sinceMonday = (day.getUTCDay() + 6) % 7;
  day.setUTCDate(day.getUTCDate() - sinceMonday);
  return day;
}

/** Which structured fields a new revision changed, as one line for a notice ("Changed: parts, cautions."). */
export function changedFieldsLine(fields: string[], isNewFix: boolean): string {
  if (isNewFix) return 'A new fix.';
  if (fields.length === 0) return 'Wording changes only.';
  return `Changed: ${fields.join(', ')}.`;
}
