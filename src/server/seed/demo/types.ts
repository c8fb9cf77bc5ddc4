// Shapes of the invented demo world, as written by hand in the files beside this one.
import type { Caution, Difficulty, PartRow, Reading } from '@/lib/schemas/revision';
import type { DeviceType, MediaFormat, Region } from '@/lib/schemas/catalogue';

/** A Tiptap/ProseMirror JSON node, as stored in revisions.body. */
export interface TiptapNode {
  type: string;
  attrs?: Record<string, unknown>;
  content?: TiptapNode[];
  marks?: { type: string; attrs?: Record<string, unknown> }[];
  text?: string;
}
export interface TiptapDoc extends TiptapNode {
  type: 'doc';
  content: TiptapNode[];
}

export interface DemoUser {
  key: string;
  email: string;
  name: string;
  shopName?: string;
  role: 'member' | 'editor' | 'moderator' | 'admin';
}

export interface DemoMaker {
  slug: string;
  name: string;
  country: string;
  about: string;
}

export interface DemoChassis {
  slug: string;
  makerSlug: string;
  name: string;
  /** The maker's own code for the platform, e.g. "VM-7". */
  code: string;
  deviceType: DeviceType;
  about: string;
}

export interface DemoMachine {
  makerSlug: string;
  chassisSlug?: string;
  modelNumber: string;
  region: Region;
  deviceType: DeviceType;
  formats: MediaFormat[];
  yearFrom: number;
  yearTo?: number;
  about: string;
}

/** An illustration drawn by our own code (SVG), attached to a revision as a photo. */
export interface DemoIllustration {
  /** Key of a drawing function in illustrations.ts. */
  drawing: string;
  alt: string;
  caption: string;
}

export interface DemoRevision {
  title: string;
  symptoms: string[];
  errorCodes: string[];
  cause: string;
  body: TiptapDoc;
  parts: PartRow[];
  readings: Reading[];
  cautions: Caution[];
  difficulty: Difficulty;
  timeMinutes: number;
  editSummary: string;
  /** DemoUser.key of the author and of the moderator who proofed it (never the same). */
  author: string;
  proofer: string;
  illustrations?: DemoIllustration[];
}

export interface DemoFix {
  slug: string;
  /** Machine keys: `${makerSlug}/${modelNumber}/${region}`. */
  machines: string[];
  chassis: string[];
  /** Oldest first; every one was proofed in turn, the last is live. */
  revisions: DemoRevision[];
}
