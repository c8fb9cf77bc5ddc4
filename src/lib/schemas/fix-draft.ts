// What a writer sends for a fix: the lenient draft shape (autosave) and the strict shape a submission must meet.
import { z } from 'zod';
import { cautionSchema, difficultySchema, partKindSchema } from './revision';
import { sanitiseBody, bodyPlainText, type BodyDoc, type BodyNode } from '@/lib/tiptap/allowlist';
import { describePart } from '@/lib/values';
import { emptyPartRow, fixDraftLimits, getAt, isRecord, setAt, type HeldFields, type Path } from './fix-draft-values';

// The plain values (limits, an empty parts row, held fields) live apart from zod, so the editor paints without it.
export { emptyPartRow, fixDraftLimits, withHeldFields, type HeldField, type HeldFields } from './fix-draft-values';

const quantityMessage = 'Quantity is a whole number from 1 to 999, e.g. 2.';
const timeMessage = 'Bench time is a whole number of minutes from 1 to 10000, e.g. 45.';

/** A text field whose messages name it and show good input: "A reference is text…", "…at most 40 characters…". */
const text = (max: number, what: string, example: string) =>
  z
    .string({ error: `${what} is text, e.g. ${example}.` })
    .trim()
    .max(max, `${what} is at most ${max} characters, e.g. ${example}.`);
/** The largest id PostgreSQL's integer columns hold: a larger one is no id of ours, and the database would refuse it. */
const LARGEST_ID = 2_147_483_647;
const ids = (max: number, message: string) =>
  z.array(z.number({ error: message }).int(message).positive(message).max(LARGEST_ID, message), { error: message }).max(max, message);

/** A parts row while it is being typed: every cell may still be empty. */
export const draftPartRowSchema = z.object(
  {
    ref: text(40, 'A reference', 'C512'),
    kind: partKindSchema,
    value: text(120, 'A part value', '470uF or 2k2'),
    rating: text(120, 'A rating', '16V 105C'),
    quantity: z.number({ error: quantityMessage }).int(quantityMessage).min(1, quantityMessage).max(999, quantityMessage),
    notes: text(500, 'A note on a part', '“low-ESR type”'),
  },
  { error: 'Each part is a row of the parts list, e.g. C512, capacitor, 470uF, 16V 105C, 1.' },
);
export type DraftPartRow = z.infer<typeof draftPartRowSchema>;

export const draftReadingSchema = z.object(
  {
    testPoint: text(120, 'A test point', 'TP12'),
    expected: text(80, 'An expected value', '5.0 V'),
    measured: text(80, 'A faulty reading', '3.1 V'),
    note: text(300, 'A note on a reading', '“with a tape loaded”'),
  },
  { error: 'Each reading is a row of the readings table, e.g. TP12, 5.0 V.' },
);
export type DraftReading = z.infer<typeof draftReadingSchema>;

/** The body as the editor sends it; cleaned by the one allowlist, refused when it is not a document. */
export const draftBodySchema = z.unknown().transform((raw, ctx): BodyDoc => {
  const result = sanitiseBody(raw);
  if ('error' in result) {
    ctx.addIssue({ code: 'custom', message: 'The remedy could not be read; copy your text, reload the page and paste it back in.' });
    return z.NEVER;
  }
  return result.doc;
});

const lines = (max: number, count: number, label: string, example: string) =>
  z
    .array(text(max, `Each ${label}`, example), {
      error: `Give each ${label} on a line of its own, e.g. ${example}.`,
    })
    .max(count, `List at most ${count} ${label}s, e.g. ${example}.`)
    .transform((list) => list.filter((line) => line !== ''));

export const fixDraftSchema = z.object({
  title: text(fixDraftLimits.title, 'The title', '“Tray opens, then closes again”'),
  symptoms: lines(fixDraftLimits.symptom, fixDraftLimits.symptoms, 'symptom', '“No rewind, play works”'),
  errorCodes: lines(fixDraftLimits.errorCode, fixDraftLimits.errorCodes, 'error code', 'E21'),
  cause: text(fixDraftLimits.cause, 'The cause', '“The loading belt has glazed”'),
  body: draftBodySchema,
  parts: z
    .array(draftPartRowSchema, { error: 'The parts list could not be read; add its rows again, e.g. C512, capacitor, 470uF.' })
    .max(
      fixDraftLimits.parts,
      `List at most ${fixDraftLimits.parts} parts rows; put identical parts on one row, e.g. 470uF with quantity 4.`,
    ),
  readings: z
    .array(draftReadingSchema, { error: 'The readings could not be read; add them again, e.g. TP12, 5.0 V.' })
    .max(fixDraftLimits.readings, `List at most ${fixDraftLimits.readings} readings, e.g. the 5 V rail at TP12.`),
  cautions: z
    .array(cautionSchema, { error: 'The cautions could not be read; add them again, e.g. mains voltage.' })
    .max(fixDraftLimits.cautions, `Give at most ${fixDraftLimits.cautions} cautions, one per hazard, e.g. mains voltage.`),
  difficulty: difficultySchema.nullable(),
  timeMinutes: z.number({ error: timeMessage }).int(timeMessage).min(1, timeMessage).max(10000, timeMessage).nullable(),
  editSummary: text(fixDraftLimits.editSummary, 'The note for the proofer', '“Added a reading at TP4”'),
  machineIds: ids(
    fixDraftLimits.machines,
    `Pick at most ${fixDraftLimits.machines} machines from the list, e.g. by typing a model number.`,
  ),
  chassisIds: ids(
    fixDraftLimits.chassis,
    `Pick at most ${fixDraftLimits.chassis} chassis families from the list, e.g. by typing a family name.`,
  ),
  photoIds: ids(fixDraftLimits.photos, `Keep at most ${fixDraftLimits.photos} photos, e.g. one for each step that needs a picture.`),
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
  need(draft.symptoms.length >= 1, ['symptoms'], 'Name at least one symptom as the owner would describe it, e.g. “No rewind”.');
  need(draft.cause.length >= 1, ['cause'], 'Say what causes the fault, e.g. “The idler tyre has hardened and slips”.');
  need(
    bodyPlainText(draft.body).length > 0,
    ['body'],
    'Write the remedy, the steps that fix the fault, e.g. “Unplug the recorder, then fit a new idler tyre”.',
  );
  need(
    draft.machineIds.length + draft.chassisIds.length >= 1,
    ['machineIds'],
    'Pick at least one machine or chassis family this fix applies to, e.g. by typing a model number.',
  );
  issues.push(...partIssues(draft.parts), ...readingIssues(draft.readings), ...bodyNodeIssues(draft.body));
  const kinds = draft.cautions.map((c) => c.kind);
  need(
    new Set(kinds).size === kinds.length,
    ['cautions'],
    'Each kind of caution appears once; put all its detail in one entry, e.g. one “Mains voltage” caution.',
  );
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
        message: `A reading in the remedy${attrs.testPoint ? ` (at ${attrs.testPoint})` : ''} needs both a test point and an expected value, e.g. TP4 and 12 V.`,
      });
    }
    if ((node.type === 'figure' || node.type === 'image') && !String(attrs.alt ?? '').trim()) {
      issues.push({
        path: ['body'],
        message: 'Every picture in the remedy needs alt text saying what it shows, e.g. “Idler tyre seated on its hub”.',
      });
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

export type DraftSplit =
  { ok: true; values: FixDraft; held: HeldFields } | { ok: false; message: string; fields: Record<string, string[]> };

const emptyReading = (): DraftReading => ({ testPoint: '', expected: '', measured: '', note: '' });
/** Lists whose rows are held cell by cell; any other field is held whole. */
const rowFallbacks: Record<string, () => Record<string, unknown>> = { parts: emptyPartRow, readings: emptyReading };

/** Where an issue is held: a cell of a parts or readings row, or else the whole top-level field. */
function holdPathOf(issuePath: PropertyKey[], input: Record<string, unknown>): Path {
  const [field, row, cell] = issuePath;
  if (typeof field !== 'string') return [];
  const makeRow = rowFallbacks[field];
  if (makeRow && typeof row === 'number' && typeof cell === 'string' && cell in makeRow() && isRecord(getAt(input, [field, row])))
    return [field, row, cell];
  return [field];
}

function fallbackAt(path: Path): unknown {
  const [field, , cell] = path;
  if (path.length === 3) return rowFallbacks[field as string]!()[cell as string];
  return (emptyDraft() as Record<string, unknown>)[field as string];
}

/**
 * Splits what a writer sent into values that pass the draft schema and fields held as typed: a draft keeps
 * everything, and an invalid field waits, marked, until it is fixed (only submission needs it valid). The remedy
 * and a body that is not a set of fields cannot be held: the editor makes them, a person never types them. Pure.
 */
export function splitDraft(raw: unknown): DraftSplit {
  if (!isRecord(raw) || Array.isArray(raw))
    return { ok: false, message: 'The draft did not arrive as a set of fields; reload the page and try again.', fields: {} };
  const input: Record<string, unknown> = { ...emptyDraft(), ...raw };
  const working = structuredClone(input);
  const held: HeldFields = {};
  // Each round replaces what failed by its empty value; a second round sees only cells the first could not reach.
  for (let round = 0; round < 3; round++) {
    const parsed = fixDraftSchema.safeParse(working);
    if (parsed.success) return { ok: true, values: parsed.data, held };
    for (const issue of parsed.error.issues) {
      const path = holdPathOf(issue.path, input);
      const field = path[0];
      if (field === undefined || field === 'body' || !(field in emptyDraft()))
        return { ok: false, message: issue.message, fields: { [issue.path.map(String).join('.') || '_']: [issue.message] } };
      const key = path.join('.');
      if (!held[key]) held[key] = { typed: getAt(input, path) ?? null, message: issue.message };
      setAt(working, path, fallbackAt(path));
    }
  }
  return { ok: false, message: 'The draft could not be read; reload the page and try again.', fields: {} };
}
