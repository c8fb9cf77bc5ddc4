// Builds the comparable form of a revision from its values and labels: shared by the server and the editor island.
import type { FixDraft } from '@/lib/schemas/fix-draft';
import { bodyPlainText } from '@/lib/tiptap/allowlist';
import type { ComparableRevision } from './revision';

export interface LabelledRevision {
  values: FixDraft;
  machines: { label: string }[];
  chassis: { label: string }[];
  photos: { id: number; alt: string; caption: string }[];
}

export function comparableFrom(revision: LabelledRevision): ComparableRevision {
  const v = revision.values;
  return {
    title: v.title,
    symptoms: v.symptoms,
    errorCodes: v.errorCodes,
    cause: v.cause,
    bodyText: bodyPlainText(v.body),
    parts: v.parts.map((p) => ({ ...p })),
    readings: v.readings,
    cautions: v.cautions,
    difficulty: v.difficulty,
    timeMinutes: v.timeMinutes,
    machines: revision.machines.map((m) => m.label),
    chassis: revision.chassis.map((c) => c.label),
    photos: revision.photos.map((p) => ({ id: p.id, alt: p.alt, caption: p.caption })),
  };
}
