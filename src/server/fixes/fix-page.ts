// What a fix page shows besides the revision itself: other technicians' bench reports and, for a member who may
// report, the machines a report can name. Loaded by the page and handed to FixArticle as props.
import { can, type SessionUser } from '@/lib/permissions';
import { eligibleMachines, listFixBenchReports, type FixBenchReport, type MachineOption } from '../bench-work/bench-reports';
import type { FixView } from './fixes';

export interface FixPageExtras {
  benchReports: FixBenchReport[];
  /** Empty unless the reader may file a bench report. */
  reportMachines: MachineOption[];
}

export async function fixPageExtras(fix: FixView, reader: SessionUser | null): Promise<FixPageExtras> {
  const [reportMachines, benchReports] = await Promise.all([
    can(reader, 'bench_report') ? eligibleMachines(fix.id) : Promise.resolve([]),
    listFixBenchReports(fix.id, reader?.id ?? null),
  ]);
  return { benchReports, reportMachines };
}
