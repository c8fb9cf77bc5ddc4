// The caution kinds a body may use and the visible label of each, shared by the editor, sanitiser and renderer.
import { cautionKinds, cautionLabels, type CautionKind } from '@/lib/schemas/revision';

export { cautionKinds, type CautionKind };

export function isCautionKind(value: unknown): value is CautionKind {
  return typeof value === 'string' && (cautionKinds as readonly string[]).includes(value);
}

/** The label shown at the top of a caution box, e.g. "Caution: mains voltage". */
export function cautionHeading(kind: CautionKind): string {
  const label = cautionLabels[kind];
  return `Caution: ${label.charAt(0).toLowerCase()}${label.slice(1)}`;
}

/** Every caution box ends with this deferral to local rules. */
export const cautionDeferral = 'Follow your local electrical codes and licensed practice.';
