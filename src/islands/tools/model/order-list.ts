// The order list as kept (browser storage or the order_lists table): merged lines by canonical spec, edits, CSV.
import { z } from 'zod';
import { buildOrderList, orderLineInputSchema, sparesFor, type OrderLine, type OrderLineInput, type Spares } from '@/lib/bench/order-list';
import { orderListCsv } from '@/lib/bench/order-list-csv';
import { partKindSchema } from '@/lib/schemas/revision';
import { normaliseText } from '@/lib/values/text-key';
import { fail, ok, type Result } from '@/lib/values/result';

export const MAX_LIST_LINES = 2000;
export const MAX_LINE_QUANTITY = 99_999;

export const storedLineSchema = z.object({
  key: z.string().min(1).max(600),
  label: z.string().min(1, 'A line needs its part.').max(600),
  kind: partKindSchema,
  quantity: z.number().int('Quantity must be a whole number.').min(1, 'Quantity is at least 1.').max(MAX_LINE_QUANTITY),
  spares: z.number().int('Spares must be a whole number.').min(0, 'Spares cannot be negative.').max(MAX_LINE_QUANTITY).default(0),
  refs: z.array(z.string().max(40)).max(1000).default([]),
  sources: z.array(z.string().max(200)).max(200).default([]),
  notes: z.array(z.string().max(500)).max(200).default([]),
  undecodable: z.boolean().default(false),
  problem: z.string().max(600).optional(),
});
export type StoredLine = z.output<typeof storedLineSchema>;

export const storedListSchema = z.object({
  lines: z.array(storedLineSchema).max(MAX_LIST_LINES, `An order list holds at most ${MAX_LIST_LINES} lines.`),
});

/** Rows to add, as carried from a fix page in the address (?add=...). */
export const addRowsSchema = z.array(orderLineInputSchema).min(1, 'No parts to add.').max(500, 'At most 500 parts at a time.');

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

function toBase64Url(bytes: Uint8Array): string {
  let binary = '';
  for (const byte of bytes) binary += String.fromCharCode(byte);
  return btoa(binary).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

function fromBase64Url(text: string): Uint8Array {
  const base64 = text.replace(/-/g, '+').replace(/_/g, '/');
  const binary = atob(base64 + '='.repeat((4 - (base64.length % 4)) % 4));
  return Uint8Array.from(binary, (c) => c.charCodeAt(0));
}

/** Longest ?add= payload read, well inside the server's header limit. */
export const MAX_ADD_PAYLOAD = 12_000;

/** Rows for the address, without empty fields so a fix's whole list stays short. */
export function encodeAddRows(rows: readonly OrderLineInput[]): string {
  const compact = rows.map((r) => Object.fromEntries(Object.entries(r).filter(([, v]) => v !== '' && v !== undefined)));
  return toBase64Url(new TextEncoder().encode(JSON.stringify(compact)));
}

export function decodeAddRows(payload: string): Result<OrderLineInput[]> {
  const example = 'a link from the "Add to order list" button on a fix page';
  if (payload.length > MAX_ADD_PAYLOAD) return fail('The list of parts in the address is too long.', example);
  if (!/^[A-Za-z0-9_-]+$/.test(payload)) return fail('The list of parts in the address is not readable.', example);
  let json: unknown;
  try {
    json = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(fromBase64Url(payload)));
  } catch {
    return fail('The list of parts in the address is not readable.', example);
  }
  const parsed = addRowsSchema.safeParse(json);
  if (!parsed.success)
    return fail(`The parts in the address are not valid: ${parsed.error.issues[0]?.message ?? 'unknown problem'}`, example);
  return ok(parsed.data);
}
