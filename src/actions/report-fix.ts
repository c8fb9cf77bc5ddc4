// The fix page's "something wrong with this fix" form as an Action: sent, or refused with what was typed kept.
import type { ActionAPIContext } from 'astro:actions';
import { can } from '@/lib/permissions';
import { fieldErrors } from '@/server/http/responses';
import { createReport } from '@/server/fixes/reports';
import { reportInputSchema } from '@/lib/schemas/fix-report-input';
import { formText, typedFields, type FormActionResult } from '@/lib/form-fields';

export type ReportFixFormResult = FormActionResult<{ fix: string }>;

const statusOf: Record<string, number> = { forbidden: 403, not_found: 404, conflict: 409, too_many_requests: 429 };

export async function submitReportFixForm(form: FormData, { locals }: Pick<ActionAPIContext, 'locals'>): Promise<ReportFixFormResult> {
  const typed = typedFields(form, ['fix', 'reason', 'detail']);
  const refuse = (status: number, message: string, fields: Record<string, string[]> = {}): ReportFixFormResult => ({
    saved: false,
    status,
    message,
    fields,
    typed,
  });
  const user = locals.user;
  if (!user) return refuse(401, 'The report was not sent: you are signed out. Sign in in another tab, then send the form again.');
  if (!can(user, 'report_fix')) return refuse(403, 'The report was not sent: confirm your e-mail address first (see your account).');
  const slug = formText(form, 'fix') ?? '';
  const parsed = reportInputSchema.safeParse({ reason: formText(form, 'reason'), detail: formText(form, 'detail') ?? '' });
  if (!parsed.success) {
    const fields = fieldErrors(parsed.error);
    const message = fields.detail
      ? 'The report was not sent: say in a sentence what is wrong, e.g. “Parts lists a 1 A fuse; the board is marked T2A.”'
      : 'The report was not sent: choose why you are reporting the fix.';
    return refuse(400, message, fields);
  }
  const created = await createReport(user, slug, parsed.data);
  if (!created.ok) return refuse(statusOf[created.code] ?? 400, `The report was not sent: ${created.message}`, created.fields);
  return { saved: true, fix: slug };
}
