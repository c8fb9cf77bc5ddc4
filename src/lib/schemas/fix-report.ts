// Why a member reports a fix to the moderators: the reasons and their labels, shared by the form, the desk and the server.
export const reportReasons = ['wrong', 'dangerous', 'spam', 'duplicate'] as const;
export type ReportReason = (typeof reportReasons)[number];

export const reportReasonLabels: Record<ReportReason, string> = {
  wrong: 'Wrong: the cause or the remedy does not hold',
  dangerous: 'Dangerous: it could hurt someone or is missing a caution',
  spam: 'Spam or advertising',
  duplicate: 'Duplicate of another fix',
};
