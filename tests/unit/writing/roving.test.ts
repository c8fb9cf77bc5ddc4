// Toolbar keys as the WAI-ARIA Authoring Practices toolbar pattern describes: arrows wrap, Home and End jump.
import { describe, expect, it } from 'vitest';
import { nextToolbarIndex } from '@/islands/editor/roving';

describe('nextToolbarIndex', () => {
  it('moves with the arrow keys and wraps at both ends', () => {
    expect(nextToolbarIndex(0, 'ArrowRight', 5)).toBe(1);
    expect(nextToolbarIndex(4, 'ArrowRight', 5)).toBe(0);
    expect(nextToolbarIndex(0, 'ArrowLeft', 5)).toBe(4);
  });

  it('jumps with Home and End and ignores other keys', () => {
    expect(nextToolbarIndex(2, 'Home', 5)).toBe(0);
    expect(nextToolbarIndex(2, 'End', 5)).toBe(4);
    expect(nextToolbarIndex(2, 'Enter', 5)).toBeNull();
    expect(nextToolbarIndex(0, 'ArrowRight', 0)).toBeNull();
  });
});
