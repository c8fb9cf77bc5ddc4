// Order list: parts rows from fixes or job sheets grouped by canonical spec, with quantities and spares.
import { z } from 'zod';
import { partKinds, partRowSchema, type PartKind } from '@/lib/schemas/revision';
import { describePart } from '@/lib/values/describe-part';
import type { PartSpec } from '@/lib/values/part-spec';
import { canonicalMagnitude } from '@/lib/values/decimal';
import { ok, type Result } from '@/lib/values/result';
import { readInput } from './input';

export const orderLineInputSchema = partRowSchema.extend({
  /** Where the row came from: a fix's title or a job sheet's name. */
  source: z
    .string({ error: 'Say where the part came from, e.g. the fix title.' })
    .trim()
    .min(1, 'Say where the part came from (a fix or a job sheet), e.g. the fix title.')
    .max(200, 'Keep where the part came from under 200 characters, e.g. the fix title.'),
});
export type OrderLineInput = z.input<typeof orderLineInputSchema>;

const SPARES_EXAMPLE = 'e.g. 2 spares per line, or 10 %';
export const sparesSchema = z.union(
  [
    z.object({
      count: z
        .number({ error: `Spares are a whole number, ${SPARES_EXAMPLE}.` })
        .int(`Spares must be a whole number, ${SPARES_EXAMPLE}.`)
        .min(0, `Spares cannot be negative, ${SPARES_EXAMPLE}.`)
        .max(999, `Spares are at most 999 per line, ${SPARES_EXAMPLE}.`),
    }),
    z.object({
      percent: z
        .number({ error: `Spares are a number of percent, ${SPARES_EXAMPLE}.` })
        .min(0, `Spares cannot be negative, ${SPARES_EXAMPLE}.`)
        .max(1000, `Spares above 1000 % are not spares, ${SPARES_EXAMPLE}.`),
    }),
  ],
  { error: `Give spares as a count or a percentage, ${SPARES_EXAMPLE}.` },
);
export type Spares = z.infer<typeof sparesSchema>;

export const orderListInputSchema = z.object(
  {
    lines: z
      .array(orderLineInputSchema, { error: 'The order list needs its parts rows, e.g. 470uF 16V × 2.' })
      .max(2000, 'An order list holds at most 2000 rows; split it in two.'),
    spares: sparesSchema.optional(),
  },
  { error: 'The order list needs its parts rows, e.g. 470uF 16V × 2.' },
);
export type OrderListInput = z.input<typeof orderListInputSchema>;

export interface OrderLine {
  key: string;
  label: string;
  kind: PartKind;
  /** Undefined when the row could not be decoded. */
  spec?: PartSpec;
  quantity: number;
  spares: number;
  /** quantity + spares: what to buy. */
  total: number;
  sources: string[];
  refs: string[];
  notes: string[];
  /** True when the value could not be read; such a row stays on the list by itself. */
  undecodable: boolean;
  problem?: string;
}

/** Spares for one line: a fixed number, or a percentage of its quantity rounded up. */
export function sparesFor(quantity: number, spares: Spares | undefined): number {
  if (!spares) return 0;
  if ('count' in spares) return spares.count;
  return Math.ceil(canonicalMagnitude((quantity * spares.percent) / 100));
}

function addUnique(list: string[], item: string): void {
  if (item !== '' && !list.includes(item)) list.push(item);
}

export function buildOrderList(input: OrderListInput): Result<OrderLine[]> {
  const read = readInput(
    orderListInputSchema,
    input,
    'a row from the fix "Tray will not close": C512, capacitor, 470uF, 16V 105C, quantity 1',
  );
  if (!read.ok) return read;
  const grouped = new Map<string, OrderLine>();
  const undecodable: OrderLine[] = [];
  read.value.lines.forEach((row, index) => {
    const spec = describePart(row.value, row.rating, { kind: row.kind });
    if (!spec.ok) {
      undecodable.push({
        key: `undecodable:${index}`,
        label: `${row.value} ${row.rating}`.trim(),
        kind: row.kind,
        quantity: row.quantity,
        spares: 0,
        total: 0,
        sources: [row.source],
        refs: row.ref === '' ? [] : [row.ref],
        notes: row.notes === '' ? [] : [row.notes],
        undecodable: true,
        problem: spec.error.message,
      });
      return;
    }
    const line = grouped.get(spec.value.key) ?? newLine(spec.value, row.kind);
    line.quantity += row.quantity;
    addUnique(line.sources, row.source);
    addUnique(line.refs, row.ref);
    addUnique(line.notes, row.notes);
    grouped.set(spec.value.key, line);
  });
  const lines = [...[...grouped.values()].sort(compareLines), ...undecodable];
  for (const line of lines) {
    line.refs.sort((a, b) => a.localeCompare(b, 'en', { numeric: true }));
    line.spares = sparesFor(line.quantity, read.value.spares);
    line.total = line.quantity + line.spares;
  }
  return ok(lines);
}

function newLine(spec: PartSpec, kind: PartKind): OrderLine {
  return {
    key: spec.key,
    label: spec.label,
    kind,
    spec,
    quantity: 0,
    spares: 0,
    total: 0,
    sources: [],
    refs: [],
    notes: [],
    undecodable: false,
  };
}

/** By kind in the catalogue's order, then by value, so capacitors read smallest to largest. */
function compareLines(a: OrderLine, b: OrderLine): number {
  const byKind = partKinds.indexOf(a.kind) - partKinds.indexOf(b.kind);
  if (byKind !== 0) return byKind;
  const magnitudeA = a.spec?.kind === 'electrical' ? a.spec.magnitude : 0;
  const magnitudeB = b.spec?.kind === 'electrical' ? b.spec.magnitude : 0;
  if (magnitudeA !== magnitudeB) return magnitudeA - magnitudeB;
  return a.label.localeCompare(b.label, 'en', { numeric: true });
}
