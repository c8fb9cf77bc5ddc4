// A member's report that a live fix is wrong, dangerous, spam or a duplicate: the form, the endpoint and the Action.
import { z } from 'zod';
import { reportReasons } from './fix-report';

export const reportInputSchema = z
  .object(
    {
      reason: z.enum(reportReasons, { error: 'Choose why you are reporting this fix.' }),
      detail: z.string({ error: 'Write the detail as text.' }).trim().max(2000, 'The detail is at most 2000 characters.').default(''),
    },
    { error: 'Send why you are reporting the fix and a sentence on what is wrong.' },
  )
  .refine((r) => r.reason === 'spam' || r.detail.length >= 10, {
    path: ['detail'],
    message: 'Say in a sentence what is wrong, so a moderator can check it.',
  });
export type ReportInputFields = z.input<typeof reportInputSchema>;
export type ReportInput = z.output<typeof reportInputSchema>;
