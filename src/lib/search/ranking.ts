// The order of search results: concepts matched (the named machine's fixes boosted), wording, closeness, bench score, fix id.

/** How well one clause of the query matched a fix (in steps of two, so the dictionary's step fits between). */
export const clauseLevel = {
  none: 0,
  /** Found in the cause, remedy, parts or machine names. */
  body: 2,
  /** Found in the title or symptoms through a dictionary synonym or broader word of a word no fix uses. */
  summaryDictionary: 3,
  /** Found in the title or symptoms through another term of its word family, or a code variant. */
  summaryAlternative: 4,
  /** Found in the title or symptoms as typed, or the exact code. */
  summary: 6,
} as const;
export type ClauseLevel = (typeof clauseLevel)[keyof typeof clauseLevel];

/** Text relevance kept coarse on purpose, so that closeness to the named machine can decide between equals. */
export interface Relevance {
  /** Weighted count of the required clauses found: in full in the title or symptoms, by half elsewhere. */
  matched: number;
  /** Sum of the clause levels, soft clauses and neighbouring-word bonuses included. */
  quality: number;
}

/** A code names one fault or one machine: finding it says more than finding a common word. */
export const CODE_WEIGHT = 2;
export const WORD_WEIGHT = 1;
/** A clause found only in the cause, remedy or parts counts this much of one found in the title or symptoms. */
export const BODY_SHARE = 0.5;

/**
 * Relevance from the levels of the required clauses (with their weights, 1 when not given) and of the
 * clauses that only rank (stop-word groups, and the bonus for typed words found side by side).
 */
export function relevanceOf(levels: readonly number[], extraLevels: readonly number[] = [], weights: readonly number[] = []): Relevance {
  const share = (level: number) => (level > clauseLevel.body ? 1 : level > clauseLevel.none ? BODY_SHARE : 0);
  return {
    matched: levels.reduce((sum, level, i) => sum + share(level) * (weights[i] ?? WORD_WEIGHT), 0),
    quality: [...levels, ...extraLevels].reduce((sum, l) => sum + l, 0),
  };
}

/** Whether every required clause was found somewhere in the fix. */
export function matchesAll(levels: readonly number[]): boolean {
  return levels.every((level) => level > clauseLevel.none);
}

/**
 * Relevance from an engine's own score in [0, 1] (the Meilisearch adapter): the score times the query's
 * concepts as the count matched, so the named machine's boost weighs the same as with PostgreSQL, and the
 * score in twenty steps as the quality.
 */
export function relevanceFromScore(score: number, concepts = 0): Relevance {
  const clamped = Number.isFinite(score) ? Math.min(1, Math.max(0, score)) : 0;
  return { matched: Math.round(clamped * concepts), quality: Math.floor(clamped * 20) };
}

/** Same machine 3, same chassis family 2, same maker 1, other 0. */
export type Proximity = 0 | 1 | 2 | 3;

export interface MachinePlace<Id> {
  machineIds: readonly Id[];
  chassisIds: readonly Id[];
  makerIds: readonly Id[];
}

/** The machine the reader named: itself, its chassis family (if any) and its maker. */
export interface ProximityTarget<Id> {
  machineId: Id;
  chassisId: Id | null;
  makerId: Id;
}

export function proximityOf<Id>(fix: MachinePlace<Id>, target: ProximityTarget<Id> | null | undefined): Proximity {
  if (!target) return 0;
  if (fix.machineIds.includes(target.machineId)) return 3;
  if (target.chassisId !== null && fix.chassisIds.includes(target.chassisId)) return 2;
  if (fix.makerIds.includes(target.makerId)) return 1;
  return 0;
}

export interface Rankable {
  fixId: number;
  relevance: Relevance;
  proximity: Proximity;
  /** Wilson lower bound; null when no bench report counts yet. */
  benchScore: number | null;
  /** How many bench reports the score rests on; when left out, the score is taken as it is. */
  benchReports?: number;
}

/**
 * A fix on the machine named, or on its chassis family, is worth this much of one matched clause: the
 * fix written for the unit on the bench wins over a closer wording on a stranger, in any scope, but a
 * stranger matching two more of the query's concepts still comes first.
 */
export const PROXIMITY_BOOST: Record<Proximity, number> = { 0: 0, 1: 0, 2: 0.5, 3: 1 };

/** Below this many bench reports a score says little, so the fix ranks as neutral rather than low. */
export const FEW_REPORTS = 3;
/** Where a new fix stands among scored ones: above a fix most technicians could not fix with, below a proven one. */
export const NEUTRAL_BENCH_SCORE = 0.5;

/** The bench score as a tie-breaker: few or no reports count as neutral, so new fixes are not buried. */
export function benchKey(score: number | null, reports?: number): number {
  if (score === null || (reports !== undefined && reports < FEW_REPORTS)) return NEUTRAL_BENCH_SCORE;
  return score;
}

/** Negative when `a` ranks first. Total and deterministic: equal keys fall back to the fix id. */
export function compareRanked(a: Rankable, b: Rankable): number {
  return (
    b.relevance.matched + PROXIMITY_BOOST[b.proximity] - (a.relevance.matched + PROXIMITY_BOOST[a.proximity]) ||
    b.relevance.quality - a.relevance.quality ||
    b.proximity - a.proximity ||
    benchKey(b.benchScore, b.benchReports) - benchKey(a.benchScore, a.benchReports) ||
    a.fixId - b.fixId
  );
}

export function rank<T extends Rankable>(items: readonly T[]): T[] {
  return [...items].sort(compareRanked);
}
