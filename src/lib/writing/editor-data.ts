// Shapes the writing pages hand to the editor island (plain JSON: they cross from server to browser).
import type { FixDraftInput, HeldFields } from '@/lib/schemas/fix-draft';
import type { RevisionState } from '@/lib/schemas/revision';

export interface LabelledRefData {
  id: number;
  /** Missing on refs restored from a browser journal written before slugs were kept. */
  slug?: string;
  label: string;
}

export interface PhotoRefData {
  id: number;
  ownerId: number;
  alt: string;
  caption: string;
  state: 'pending' | 'ready' | 'failed';
  error: string | null;
  width: number;
  height: number;
  thumbSrc: string | null;
  figureSrc: string | null;
}

/** A revision as the server sends it (RevisionRecord), trimmed to what the island reads. */
export interface EditorRevisionData {
  id: number;
  number: number;
  state: RevisionState;
  fixSlug: string | null;
  liveRevisionId: number | null;
  baseRevisionId: number | null;
  baseRevisionNumber: number | null;
  authorName: string;
  updatedAt: string;
  values: FixDraftInput;
  /** Fields the server holds as typed because they fail their checks; absent on older answers. */
  held?: HeldFields;
  machines: LabelledRefData[];
  chassis: LabelledRefData[];
  photos: PhotoRefData[];
}

export interface FixEditorProps {
  /** The live fix being edited; null for a new fix. */
  fixSlug: string | null;
  /** The writer's draft, when one exists. */
  draft: EditorRevisionData | null;
  /** Where a new draft starts when there is none yet: the live revision, an older one being restored, or empty. */
  start: { values: FixDraftInput; machines: LabelledRefData[]; chassis: LabelledRefData[]; photos: PhotoRefData[] };
  liveRevisionNumber: number | null;
  /** A line shown above the form, e.g. that an older revision is being restored as a new one. */
  notice: string | null;
  /** The address the writer's revision list lives at, where a submission sends them. */
  doneHref: string;
}
