// The order list as kept (browser storage or the order_lists table): merged lines by canonical spec, edits, CSV.
import { z } from 'zod';
import { buildOrderList, sparesFor, type OrderLine, type OrderLineInput, type Spares } from '@/lib/bench/order-list';
import { orderListCsv } from '@/lib/bench/order-list-csv';
import { partKinds } from '@/lib/schemas/revision';
import { normaliseText } from '@/lib/values/text-key';
import { ok, type Result } from '@/lib/values/result';

export const MAX_LIST_LINES = 2000;
export const MAX_LINE_QUANTITY = 99_999;

/** Text of a stored line, at most max characters; the message names the field and an example. */
const storedText = (what: string, max: number, example: string) =>
  z.string({ error: `${what} is text, e.g. ${example}.` }).max(max, `${what} is longer than ${max} characters; e.g. ${example}.`);
const storedTexts = (what: string, max: number, count: number, example: string) =>
  z
    .array(storedText(what, max, example), { error: `${what} is a list, e.g. ${example}.` })
    .max(count, `At most ${count} ${what.toLowerCase()} per line.`);
const wholeCount = (what: string, min: number) =>
  z
    .number({ error: `${what} is a whole number, e.g. 2.` })
    .int(`${what} must be a whole number, e.g. 2.`)
    .min(min, min === 0 ? `${what} cannot be negative, e.g. 0 or 2.` : `${what} is at least ${min}, e.g. 2.`)
    .max(MAX_LINE_QUANTITY, `${what} is at most ${MAX_LINE_QUANTITY}, e.g. 2.`);

export const storedLineSchema = z.object(
  {
    key: storedText('The line key', 600, 'capacitance:470 µF 16 V').min(1, 'A line needs its key, e.g. capacitance:470 µF 16 V.'),
    label: storedText('The part', 600, '470 µF 16 V').min(1, 'A line needs its part, e.g. 470 µF 16 V.'),
    kind: z.enum(partKinds, { error: 'The kind of part is one from the list, e.g. capacitor or belt.' }),
    quantity: wholeCount('Quantity', 1),
    spares: wholeCount('Spares', 0).default(0),
    refs: storedTexts('References', 40, 1000, 'C512').default([]),
    sources: storedTexts('Sources', 200, 200, 'a fix title').default([]),
    notes: storedTexts('Notes', 500, 200, 'fit a 105 °C part').default([]),
    undecodable: z.boolean({ error: 'Whether the value was read is yes or no (true or false).' }).default(false),
    problem: storedText('The problem', 600, 'the value has no unit').optional(),
  },
  { error: 'An order line is the part, its kind and quantity, e.g. 470 µF 16 V, capacitor, 2.' },
);
export type StoredLine = z.output<typeof storedLineSchema>;

export const storedListSchema = z.object(
  {
    lines: z
      .array(storedLineSchema, { error: 'The order list holds a list of lines, e.g. 470 µF 16 V × 2.' })
      .max(MAX_LIST_LINES, `An order list holds at most ${MAX_LIST_LINES} lines.`),
  },
  { error: 'The order list holds a list of lines, e.g. 470 µF 16 V × 2.' },
);

/** Undecodable lines group by their text, so the same unreadable row from two fixes is one line. */
function storedKey(line: OrderLine): string {
  return line.undecodable ? `undecodable:${line.kind}:${normaliseText(line.label)}` : line.key;
}

function union(into: string[], items: readonly string[]): string[] {
  const out = [...into];
  for (const item of items) if (item !== '' && !out.includes(item)) out.push(item);
  return out;
}

function mergeLine(existing: StoredLine, incoming: StoredLine): StoredLine {
  return {
    ...existing,
    quantity: Math.min(MAX_LINE_QUANTITY, existing.quantity + incoming.quantity),
    spares: Math.min(MAX_LINE_QUANTITY, existing.spares + incoming.spares),
    refs: union(existing.refs, incoming.refs).sort((a, b) => a.localeCompare(b, 'en', { numeric: true })),
    sources: union(existing.sources, incoming.sources),
    notes: union(existing.notes, incoming.notes),
  };
}

/** Lines of b merged into a by key: equal parts add their quantities, new parts come after. */
export function mergeLists(a: readonly StoredLine[], b: readonly StoredLine[]): StoredLine[] {
  const out = [...a];
  for (const line of b) {
    const at = out.findIndex((l) => l.key === line.key);
    if (at >= 0) out[at] = mergeLine(out[at] as StoredLine, line);
    else out.push(line);
  }
  return out.slice(0, MAX_LIST_LINES);
}

function toStored(line: OrderLine): StoredLine {
  const stored: StoredLine = {
    key: storedKey(line),
    label: line.label.slice(0, 600),
    kind: line.kind,
    quantity: Math.max(1, Math.min(MAX_LINE_QUANTITY, line.quantity)),
    spares: 0,
    refs: line.refs,
    sources: line.sources,
    notes: line.notes,
    undecodable: line.undecodable,
  };
  if (line.problem) stored.problem = line.problem.slice(0, 600);
  return stored;
}

/** Parts rows grouped by canonical spec (buildOrderList) and merged into the list. */
export function addRows(existing: readonly StoredLine[], rows: readonly OrderLineInput[]): Result<StoredLine[]> {
  const grouped = buildOrderList({ lines: [...rows] });
  if (!grouped.ok) return grouped;
  return ok(mergeLists(existing, grouped.value.map(toStored)));
}

export function setQuantity(lines: readonly StoredLine[], key: string, quantity: number): StoredLine[] {
  if (!Number.isInteger(quantity) || quantity < 1) return [...lines];
  return lines.map((l) => (l.key === key ? { ...l, quantity: Math.min(MAX_LINE_QUANTITY, quantity) } : l));
}

export function setSpares(lines: readonly StoredLine[], key: string, spares: number): StoredLine[] {
  if (!Number.isInteger(spares) || spares < 0) return [...lines];
  return lines.map((l) => (l.key === key ? { ...l, spares: Math.min(MAX_LINE_QUANTITY, spares) } : l));
}

/** The same spares rule for every line: a fixed count, or a percentage rounded up (sparesFor). */
export function applySpares(lines: readonly StoredLine[], spares: Spares | undefined): StoredLine[] {
  return lines.map((l) => ({ ...l, spares: Math.min(MAX_LINE_QUANTITY, sparesFor(l.quantity, spares)) }));
}

export function removeLine(lines: readonly StoredLine[], key: string): StoredLine[] {
  return lines.filter((l) => l.key !== key);
}

/** Stored lines in the shape the CSV writer takes. */
export function toOrderLines(lines: readonly StoredLine[]): OrderLine[] {
  return lines.map((l) => ({
    key: l.key,
    label: l.label,
    kind: l.kind,
    quantity: l.quantity,
    spares: l.spares,
    total: l.quantity + l.spares,
    sources: l.sources,
    refs: l.refs,
    notes: l.notes,
    undecodable: l.undecodable,
    ...(l.problem ? { problem: l.problem } : {}),
  }));
}

export function storedListCsv(lines: readonly StoredLine[]): string {
  return orderListCsv(toOrderLines(lines));
}

/** Reads a stored list that may be old or edited by hand: bad lines are dropped, never a crash. */
export function readStoredLines(raw: unknown): StoredLine[] {
  if (!Array.isArray(raw)) return [];
  const lines: StoredLine[] = [];
  for (const item of raw.slice(0, MAX_LIST_LINES)) {
    const parsed = storedLineSchema.safeParse(item);
    if (parsed.success && !lines.some((l) => l.key === parsed.data.key)) lines.push(parsed.data);
  }
  return lines;
}
