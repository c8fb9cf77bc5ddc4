// The bench report form (fix page and job sheet) as an Action: saved, or refused with everything typed kept.
import type { ActionAPIContext } from 'astro:actions';
import { can } from '@/lib/permissions';
import { fieldErrors } from '@/server/http/responses';
import { consume } from '@/server/http/rate-limit';
import { benchReportFromForm, saveBenchReport } from '@/server/bench-work/bench-reports';
import { benchFormFields, benchRefusal, benchReportInputSchema } from '@/lib/schemas/bench-report';
import { typedFields, type FormActionResult } from '@/lib/form-fields';

export type BenchReportFormResult = FormActionResult<{ fix: string; counted: boolean }>;

export async function submitBenchReportForm(form: FormData, { locals }: Pick<ActionAPIContext, 'locals'>): Promise<BenchReportFormResult> {
  const typed = typedFields(form, benchFormFields);
  const refuse = (status: number, message: string, fields: Record<string, string[]> = {}): BenchReportFormResult => ({
    saved: false,
    status,
    message,
    fields,
    typed,
  });
  const user = locals.user;
  // A session that ended while the member typed: keep the text so it can be sent again after signing in.
  if (!user) return refuse(401, 'The report was not saved: you are signed out. Sign in in another tab, then send the form again.');
  if (!can(user, 'bench_report')) return refuse(403, 'The report was not saved: confirm your e-mail address first (see your account).');
  const limit = await consume('bench_report', { account: String(user.id) });
  if (!limit.ok) return refuse(429, `The report was not saved: ${limit.message.charAt(0).toLowerCase()}${limit.message.slice(1)}`);
  const parsed = benchReportInputSchema.safeParse(benchReportFromForm(form));
  if (!parsed.success) {
    const fields = fieldErrors(parsed.error);
    return refuse(400, benchRefusal(fields), fields);
  }
  const saved = await saveBenchReport(user.id, parsed.data);
  if (!saved.ok) {
    if (saved.code === 'not_found') return refuse(404, 'The report was not saved: the fix is no longer available.');
    return refuse(400, benchRefusal(saved.fields ?? {}), saved.fields);
  }
  return { saved: true, fix: parsed.data.fix, counted: saved.report.counted };
}
