// What the writing page asks GET /api/v1/search/similar while a fix is written, and how the answers are shown.
import type { SimilarFix } from './result-types';
import { MAX_QUERY_LENGTH } from './tokens';

/** A machine or chassis family the draft names; the slug may be missing on refs restored from an older browser journal. */
export interface TargetRef {
  slug?: string | undefined;
}

export interface DraftSubject {
  title: string;
  symptoms: readonly string[];
  machines: readonly TargetRef[];
  chassis: readonly TargetRef[];
}

export interface SimilarRequest {
  symptom: string;
  target: { kind: 'machine' | 'chassis'; slug: string };
}

/** Fewer letters than this say nothing a search could match on ("tr" while "tray" is being typed). */
export const MIN_SUBJECT_LENGTH = 4;
/** One request per machine or family named, at most this many: most fixes name one or two. */
export const MAX_SIMILAR_TARGETS = 3;
/** As many as the endpoint answers for one target. */
export const MAX_SIMILAR_SHOWN = 5;

/**
 * The words to compare: the first symptom written (a fix's headline fault), or the title while no symptom
 * is written yet. Spaces are collapsed so a trailing space typed does not make a new request.
 */
export function subjectText(draft: Pick<DraftSubject, 'title' | 'symptoms'>): string {
  const tidy = (text: string) => text.replace(/\s+/g, ' ').trim();
  const symptom = draft.symptoms.map(tidy).find((s) => s !== '');
  return (symptom ?? tidy(draft.title)).slice(0, MAX_QUERY_LENGTH).trim();
}

/** The requests worth sending for the draft as it stands; none until it has both a subject and a machine or family. */
export function similarRequests(draft: DraftSubject): SimilarRequest[] {
  const symptom = subjectText(draft);
  if (symptom.replace(/[^\p{L}\p{N}]/gu, '').length < MIN_SUBJECT_LENGTH) return [];
  const targets = [
    ...draft.machines.map((m) => ({ kind: 'machine' as const, slug: m.slug })),
    ...draft.chassis.map((c) => ({ kind: 'chassis' as const, slug: c.slug })),
  ].filter((t): t is SimilarRequest['target'] => typeof t.slug === 'string' && t.slug !== '');
  return targets.slice(0, MAX_SIMILAR_TARGETS).map((target) => ({ symptom, target }));
}

export function similarPath(request: SimilarRequest): string {
  const params = new URLSearchParams({ symptom: request.symptom, [request.target.kind]: request.target.slug });
  return `/api/v1/search/similar?${params}`;
}

/**
 * The answers for each target as one list: a fix found through two machines shows once (its best likeness,
 * "same machine" if either said so), the fix being edited never shows, best first.
 */
export function mergeSimilar(answers: readonly (readonly SimilarFix[])[], editingSlug: string | null): SimilarFix[] {
  const bySlug = new Map<string, SimilarFix>();
  for (const fix of answers.flat()) {
    if (fix.slug === editingSlug) continue;
    const seen = bySlug.get(fix.slug);
    bySlug.set(
      fix.slug,
      seen ? { ...seen, likeness: Math.max(seen.likeness, fix.likeness), sameMachine: seen.sameMachine || fix.sameMachine } : fix,
    );
  }
  return [...bySlug.values()]
    .sort((a, b) => b.likeness - a.likeness || Number(b.sameMachine) - Number(a.sameMachine) || a.slug.localeCompare(b.slug))
    .slice(0, MAX_SIMILAR_SHOWN);
}

/** The notice's heading: says whether the fixes are for the machine itself, its family, or both. */
export function similarHeading(fixes: readonly SimilarFix[], askedAboutMachine: boolean): string {
  const one = fixes.length === 1;
  const same = fixes.filter((f) => f.sameMachine).length;
  const where = !askedAboutMachine
    ? 'this chassis family'
    : same === fixes.length
      ? 'this machine'
      : same === 0
        ? "this machine's chassis family"
        : 'this machine and its chassis family';
  return `${one ? 'This fix' : 'These fixes'} for ${where} ${one ? 'looks' : 'look'} similar`;
}
