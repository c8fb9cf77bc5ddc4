// Running state of one sanitising walk: notes about what was removed, and the counters behind the limits.
import { bodyLimits } from '../rules';

/** Thrown inside the walk when a limit is passed; sanitiseBody turns it into { error }. */
export class BodyLimitError extends Error {}

export class SanitiseContext {
  private readonly notes = new Set<string>();
  private nodeCount = 0;
  private textLength = 0;

  /** Records one removal or change; repeated notes are kept once, and the list is capped. */
  note = (message: string): void => {
    if (this.notes.size < bodyLimits.maxNotes) this.notes.add(message);
  };

  /** Counts a node about to be read at the given depth (the document itself is depth 0). */
  visit(depth: number): void {
    if (depth > bodyLimits.maxDepth) {
      throw new BodyLimitError(`The body is nested more than ${bodyLimits.maxDepth} levels deep.`);
    }
    this.nodeCount += 1;
    if (this.nodeCount > bodyLimits.maxNodes) {
      throw new BodyLimitError(`The body has more than ${bodyLimits.maxNodes} nodes.`);
    }
  }

  addText(length: number): void {
    this.textLength += length;
    if (this.textLength > bodyLimits.maxTextLength) {
      throw new BodyLimitError(`The body's text is longer than ${bodyLimits.maxTextLength} characters.`);
    }
  }

  droppedNotes(): string[] {
    return [...this.notes];
  }
}

/** Shortens a type or attribute name taken from the input before it goes into a note. */
export function nameForNote(name: string): string {
  const printable = name.replace(/[^\w.:-]/g, '?');
  return printable.length > 40 ? `${printable.slice(0, 40)}...` : printable;
}
