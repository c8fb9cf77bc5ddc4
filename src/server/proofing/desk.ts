// The proofing desk's queue: revisions waiting for a moderator, filtered (age, author, machine, kind) and paged.
import type { Knex } from 'knex';
import { z } from 'zod';
import { db } from '../core/db';

export interface DeskEntry {
  revisionId: number;
  number: number;
  title: string;
  /** True for the first revision of a fix that has never been live. */
  isNewFix: boolean;
  fixSlug: string | null;
  machines: string[];
  authorId: number;
  authorName: string;
  submittedAt: Date;
  /** What the author says they changed (the edit summary); empty when they said nothing. */
  editSummary: string;
  /** The fix went live with another revision after this one was written: it cannot be proofed as it is. */
  staleBase: boolean;
  /** The revision this one continues: a returned one its author answers, or a waiting one a moderator amended. */
  amends: { number: number; byItsAuthor: boolean; wasReturned: boolean } | null;
}

export const DESK_PAGE_SIZE = 50;

/** How long a revision has waited, as the desk's filter offers it. */
export const deskAges = { any: 0, day: 1, '3days': 3, week: 7 } as const;
export type DeskAge = keyof typeof deskAges;

/** A chosen author or machine; empty (or anything else) means all of them. */
const idFilter = z.union([z.coerce.number().int().positive().max(2_147_483_647), z.null()]).catch(null);

/** The desk's GET form; an unknown value falls back to "any", so a hand-edited address still shows the queue. */
export const deskFilterSchema = z.object({
  waited: z.enum(Object.keys(deskAges) as [DeskAge, ...DeskAge[]]).catch('any'),
  kind: z.enum(['any', 'new', 'edit']).catch('any'),
  author: idFilter,
  machine: idFilter,
  order: z.enum(['oldest', 'newest']).catch('oldest'),
  page: z.coerce.number().int().min(1).max(10_000).catch(1),
});
export type DeskFilter = z.infer<typeof deskFilterSchema>;

export function deskFilterOf(params: URLSearchParams): DeskFilter {
  return deskFilterSchema.parse({
    waited: params.get('waited') ?? 'any',
    kind: params.get('kind') ?? 'any',
    author: params.get('author') ?? '',
    machine: params.get('machine') ?? '',
    order: params.get('order') ?? 'oldest',
    page: params.get('page') ?? 1,
  });
}

/** The filter as query values, leaving out the defaults, for page links that keep it. */
export function deskFilterParams(filter: DeskFilter): Record<string, string> {
  const out: Record<string, string> = {};
  if (filter.waited !== 'any') out.waited = filter.waited;
  if (filter.kind !== 'any') out.kind = filter.kind;
  if (filter.author) out.author = String(filter.author);
  if (filter.machine) out.machine = String(filter.machine);
  if (filter.order !== 'oldest') out.order = filter.order;
  return out;
}

export interface DeskChoice {
  id: number;
  label: string;
  waiting: number;
}

export interface DeskQueue {
  entries: DeskEntry[];
  /** Waiting revisions matching the filter, on every page. */
  matching: number;
  /** Waiting revisions in all. */
  total: number;
  page: number;
  pageCount: number;
  /** The authors and machines with something waiting, for the filter's lists. */
  authors: DeskChoice[];
  machines: DeskChoice[];
}

function waitingRevisions(knex: Knex): Knex.QueryBuilder {
  return knex('revisions as r').join('fixes as f', 'f.id', 'r.fix_id').where('r.state', 'submitted').whereNull('f.deleted_at');
}

function applyFilter(knex: Knex, q: Knex.QueryBuilder, filter: DeskFilter): Knex.QueryBuilder {
  const days = deskAges[filter.waited];
  if (days > 0) q.where('r.submitted_at', '<=', knex.raw(`now() - make_interval(days => ?)`, [days]));
  if (filter.kind === 'new') q.whereNull('f.current_revision_id');
  if (filter.kind === 'edit') q.whereNotNull('f.current_revision_id');
  if (filter.author) q.where('r.author_id', filter.author);
  if (filter.machine)
    q.whereExists(knex('revision_machines as fm').whereRaw('fm.revision_id = r.id').where('fm.machine_id', filter.machine));
  return q;
}

async function filterChoices(knex: Knex): Promise<{ authors: DeskChoice[]; machines: DeskChoice[] }> {
  const [authors, machines] = await Promise.all([
    waitingRevisions(knex)
      .join('users as a', 'a.id', 'r.author_id')
      .groupBy('a.id', 'a.name')
      .orderBy('a.name')
      .select('a.id', 'a.name as label', knex.raw('count(*)::int AS waiting')),
    waitingRevisions(knex)
      .join('revision_machines as rm', 'rm.revision_id', 'r.id')
      .join('machines as m', 'm.id', 'rm.machine_id')
      .join('makers as mk', 'mk.id', 'm.maker_id')
      .groupBy('m.id', 'mk.name', 'm.model_number', 'm.region')
      .orderBy(['mk.name', 'm.model_number', 'm.region'])
      .select(
        'm.id',
        knex.raw(`mk.name || ' ' || m.model_number || ' (' || m.region || ')' AS label`),
        knex.raw('count(*)::int AS waiting'),
      ),
  ]);
  return {
    authors: (authors as DeskChoice[]).map((a) => ({ ...a, label: a.label ?? 'a former member' })),
    machines: machines as DeskChoice[],
  };
}

/** One page of the revisions waiting for proofing, oldest first unless asked otherwise, with what the filter can offer. */
export async function deskQueue(filter: DeskFilter): Promise<DeskQueue> {
  const knex = db();
  const [matchingRow, totalRow, choices] = await Promise.all([
    applyFilter(knex, waitingRevisions(knex), filter).count<{ n: string }[]>('r.id as n').first(),
    waitingRevisions(knex).count<{ n: string }[]>('r.id as n').first(),
    filterChoices(knex),
  ]);
  const matching = Number(matchingRow?.n ?? 0);
  const pageCount = Math.max(1, Math.ceil(matching / DESK_PAGE_SIZE));
  const page = Math.min(filter.page, pageCount);
  const direction = filter.order === 'newest' ? 'desc' : 'asc';
  const rows = await applyFilter(knex, waitingRevisions(knex), filter)
    .join('users as a', 'a.id', 'r.author_id')
    .leftJoin('revisions as am', 'am.id', 'r.amends_revision_id')
    .orderBy([
      { column: 'r.submitted_at', order: direction },
      { column: 'r.id', order: direction },
    ])
    .limit(DESK_PAGE_SIZE)
    .offset((page - 1) * DESK_PAGE_SIZE)
    .select(
      'r.id',
      'r.number',
      'r.title',
      'r.author_id',
      'r.submitted_at',
      'r.parent_revision_id',
      'r.edit_summary',
      'f.slug',
      'f.current_revision_id',
      'a.name as author_name',
      'am.number as amends_number',
      'am.author_id as amends_author_id',
      'am.returned_at as amends_returned_at',
      knex.raw(
        `ARRAY(SELECT mk.name || ' ' || m.model_number || ' (' || m.region || ')' FROM revision_machines rm JOIN machines m ON m.id = rm.machine_id
           JOIN makers mk ON mk.id = m.maker_id WHERE rm.revision_id = r.id ORDER BY 1) AS machines`,
      ),
    );
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- raw rows joined from four tables
  const entries: DeskEntry[] = rows.map((r: Record<string, any>) => ({
    revisionId: r.id,
    number: r.number,
    title: r.title,
    isNewFix: r.current_revision_id === null,
    fixSlug: r.current_revision_id ? r.slug : null,
    machines: r.machines,
    authorId: r.author_id,
    authorName: r.author_name ?? 'a former member',
    submittedAt: r.submitted_at,
    editSummary: r.edit_summary ?? '',
    staleBase: r.parent_revision_id !== r.current_revision_id,
    amends:
      r.amends_number === null
        ? null
        : { number: r.amends_number, byItsAuthor: r.amends_author_id === r.author_id, wasReturned: r.amends_returned_at !== null },
  }));
  return { entries, matching, total: Number(totalRow?.n ?? 0), page, pageCount, ...choices };
}
