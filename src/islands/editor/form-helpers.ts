// Small pure helpers of the editor form: errors into a summary, a live section carried into the form.
import type { FieldErrors } from 'react-hook-form';
import type { FixDraftInput } from '@/lib/schemas/fix-draft';
import { fieldIdOf, type SummaryItem } from './ErrorSummary';
import type { SectionName } from './StaleBasePanel';

/** Every message in react-hook-form's nested error object, with the field it belongs to. */
export function flattenErrors(errors: FieldErrors<FixDraftInput>): SummaryItem[] {
  const items: SummaryItem[] = [];
  const walk = (node: unknown, path: string[]) => {
    if (!node || typeof node !== 'object') return;
    const message = (node as { message?: unknown }).message;
    if (typeof message === 'string' && message !== '') {
      items.push({ fieldId: fieldIdOf(path.join('.')), message });
      return;
    }
    for (const [key, child] of Object.entries(node)) if (key !== 'ref' && key !== 'type') walk(child, [...path, key]);
  };
  walk(errors, []);
  return items;
}

/** Which form values a section of the stale-base comparison stands for. */
export const sectionFields: Record<SectionName, (keyof FixDraftInput)[]> = {
  Title: ['title'],
  Machines: ['machineIds', 'chassisIds'],
  Symptoms: ['symptoms', 'errorCodes'],
  Cause: ['cause'],
  'Difficulty and time': ['difficulty', 'timeMinutes'],
  Cautions: ['cautions'],
  Remedy: ['body'],
  Parts: ['parts'],
  Readings: ['readings'],
  Photos: ['photoIds'],
};

/** Field messages from the server (400), keyed by dotted path, as a summary. */
export function serverFieldItems(fields: Record<string, string[]>): SummaryItem[] {
  return Object.entries(fields).flatMap(([path, messages]) => messages.map((message) => ({ fieldId: fieldIdOf(path), message })));
}
