// What a writer sends for a fix: the lenient draft shape (autosave) and the strict shape a submission must meet.
import { z } from 'zod';
import { cautionSchema, difficultySchema, partKindSchema } from './revision';
import { sanitiseBody, bodyPlainText, type BodyDoc, type BodyNode } from '@/lib/tiptap/allowlist';
import { describePart } from '@/lib/values';

export const fixDraftLimits = {
  title: 160,
  symptom: 200,
  symptoms: 20,
  errorCode: 40,
  errorCodes: 20,
  cause: 2000,
  parts: 100,
  readings: 50,
  cautions: 6,
  editSummary: 300,
  machines: 50,
  chassis: 20,
  photos: 30,
} as const;

const id = z.number().int().positive();

/** A parts row while it is being typed: every cell may still be empty. */
export const draftPartRowSchema = z.object({
  ref: z.string().trim().max(40),
  kind: partKindSchema,
  value: z.string().trim().max(120),
  rating: z.string().trim().max(120),
  quantity: z
    .number({ error: 'Quantity is a whole number from 1 to 999.' })
    .int('Quantity is a whole number.')
    .min(1, 'Quantity is at least 1.')
    .max(999, 'Quantity is at most 999.'),
  notes: z.string().trim().max(500),
});
export type DraftPartRow = z.infer<typeof draftPartRowSchema>;

export const draftReadingSchema = z.object({
  testPoint: z.string().trim().max(120),
  expected: z.string().trim().max(80),
  measured: z.string().trim().max(80),
  note: z.string().trim().max(300),
});
export type DraftReading = z.infer<typeof draftReadingSchema>;

/** The body as the editor sends it; cleaned by the one allowlist, refused when it is not a document. */
export const draftBodySchema = z.unknown().transform((raw, ctx): BodyDoc => {
  const result = sanitiseBody(raw);
  if ('error' in result) {
    ctx.addIssue({ code: 'custom', message: `The remedy could not be read: ${result.error}` });
    return z.NEVER;
  }
  return result.doc;
});

const lines = (max: number, count: number, label: string) =>
  z
    .array(z.string().trim().max(max, `Each ${label} is at most ${max} characters.`))
    .max(count, `At most ${count} ${label}s.`)
    .transform((list) => list.filter((line) => line !== ''));

export const fixDraftSchema = z.object({
  title: z.string().trim().max(fixDraftLimits.title, `The title is at most ${fixDraftLimits.title} characters.`),
  symptoms: lines(fixDraftLimits.symptom, fixDraftLimits.symptoms, 'symptom'),
  errorCodes: lines(fixDraftLimits.errorCode, fixDraftLimits.errorCodes, 'error code'),
  cause: z.string().trim().max(fixDraftLimits.cause, `The cause is at most ${fixDraftLimits.cause} characters.`),
  body: draftBodySchema,
  parts: z.array(draftPartRowSchema).max(fixDraftLimits.parts, `At most ${fixDraftLimits.parts} parts rows.`),
  readings: z.array(draftReadingSchema).max(fixDraftLimits.readings),
  cautions: z.array(cautionSchema).max(fixDraftLimits.cautions),
  difficulty: difficultySchema.nullable(),
  timeMinutes: z.number().int('Bench time is whole minutes.').min(1, 'Bench time is at least 1 minute.').max(10000).nullable(),
  editSummary: z.string().trim().max(fixDraftLimits.editSummary),
  machineIds: z.array(id).max(fixDraftLimits.machines),
  chassisIds: z.array(id).max(fixDraftLimits.chassis),
  photoIds: z.array(id).max(fixDraftLimits.photos),
});
/** What the island holds and sends (before zod's cleaning). */
export type FixDraftInput = z.input<typeof fixDraftSchema>;
/** What the server stores. */
export type FixDraft = z.output<typeof fixDraftSchema>;

type Issue = { path: (string | number)[]; message: string };

/** The strict rules a revision must meet to be submitted; every failure names its field. Pure. */
export function submissionIssues(draft: FixDraft): Issue[] {
  const issues: Issue[] = [];
  const need = (ok: boolean, path: (string | number)[], message: string) => {
    if (!ok) issues.push({ path, message });
  };
  need(draft.title.length >= 5, ['title'], 'Give the fix a title of at least 5 characters, e.g. "Tray opens, then closes again".');
  need(draft.symptoms.length >= 1, ['symptoms'], 'Name at least one symptom, as the owner would describe it.');
  need(draft.cause.length >= 1, ['cause'], 'Say what causes the fault.');
  need(bodyPlainText(draft.body).length > 0, ['body'], 'Write the remedy: the steps that fix the fault.');
  need(
    draft.machineIds.length + draft.chassisIds.length >= 1,
    ['machineIds'],
    'Pick at least one machine or chassis family this fix applies to.',
  );
  issues.push(...partIssues(draft.parts), ...readingIssues(draft.readings), ...bodyNodeIssues(draft.body));
  const kinds = draft.cautions.map((c) => c.kind);
  need(new Set(kinds).size === kinds.length, ['cautions'], 'Each kind of caution appears once; put all its detail in one entry.');
  return issues;
}

function partIssues(parts: DraftPartRow[]): Issue[] {
  const issues: Issue[] = [];
  parts.forEach((row, i) => {
    if (row.value === '') {
      issues.push({ path: ['parts', i, 'value'], message: 'Give the part value, e.g. 470uF or 2k2.' });
      return;
    }
    const decoded = describePart(row.value, row.rating, { kind: row.kind });
    if (!decoded.ok)
      issues.push({ path: ['parts', i, 'value'], message: `${decoded.error.message} For example: ${decoded.error.example}` });
  });
  return issues;
}

function readingIssues(readings: DraftReading[]): Issue[] {
  const issues: Issue[] = [];
  readings.forEach((r, i) => {
    if (r.testPoint === '')
      issues.push({ path: ['readings', i, 'testPoint'], message: 'Name the test point, e.g. TP12 or the 5 V rail at C512.' });
    if (r.expected === '') issues.push({ path: ['readings', i, 'expected'], message: 'Give the expected value, e.g. 5.0 V.' });
  });
  return issues;
}

/** Readings and pictures inside the remedy follow the same rules as the structured fields. */
function bodyNodeIssues(doc: BodyDoc): Issue[] {
  const issues: Issue[] = [];
  const visit = (node: BodyNode) => {
    const attrs = node.attrs ?? {};
    if (node.type === 'reading' && (!attrs.testPoint || !attrs.expected)) {
      issues.push({
        path: ['body'],
        message: `A reading in the remedy${attrs.testPoint ? ` (at ${attrs.testPoint})` : ''} needs both a test point and an expected value.`,
      });
    }
    if ((node.type === 'figure' || node.type === 'image') && !String(attrs.alt ?? '').trim()) {
      issues.push({ path: ['body'], message: 'Every picture in the remedy needs alt text: what it shows, for readers who cannot see it.' });
    }
    node.content?.forEach(visit);
  };
  visit(doc);
  return issues;
}

/** The strict schema: the draft shape plus the submission rules, for the island's resolver and the server alike. */
export const fixSubmissionSchema = fixDraftSchema.superRefine((draft, ctx) => {
  for (const issue of submissionIssues(draft)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
});

/** An empty draft, optionally prefilled from a search that found nothing ("?symptom=...&machine=..."). */
export function emptyDraft(prefill: { symptom?: string; machineIds?: number[] } = {}): FixDraftInput {
  return {
    title: '',
    symptoms: prefill.symptom ? [prefill.symptom.slice(0, fixDraftLimits.symptom)] : [],
    errorCodes: [],
    cause: '',
    body: { type: 'doc', content: [{ type: 'paragraph' }] },
    parts: [],
    readings: [],
    cautions: [],
    difficulty: null,
    timeMinutes: null,
    editSummary: '',
    machineIds: prefill.machineIds ?? [],
    chassisIds: [],
    photoIds: [],
  };
}

export function emptyPartRow(): DraftPartRow {
  return { ref: '', kind: 'capacitor', value: '', rating: '', quantity: 1, notes: '' };
}
