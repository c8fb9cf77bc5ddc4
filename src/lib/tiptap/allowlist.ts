// Public entry for what a fix body may contain and the functions that enforce and read it.
export {
  allowedMarkAttributes,
  allowedMarkTypes,
  allowedNodeAttributes,
  allowedNodeTypes,
  attributeLengthLimits,
  bodyLimits,
  numberRanges,
  type BodyMarkType,
  type BodyNodeType,
} from './rules';
export { sanitiseBody, type SanitiseBodyResult } from './sanitise/sanitise-body';
export { bodyPlainText } from './plain-text';
export { isSafeImageSrc, isSafeLinkHref } from './urls';
export type { BodyDoc, BodyMark, BodyNode } from './types';
