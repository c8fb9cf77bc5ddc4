// Roving tabindex for the toolbar: one button in the tab order, arrow keys move between them (WAI-ARIA toolbar pattern).

/** The index focus moves to for a key, or null when the key is not a toolbar movement key. */
export function nextToolbarIndex(current: number, key: string, count: number): number | null {
  if (count <= 0) return null;
  switch (key) {
    case 'ArrowRight':
    case 'ArrowDown':
      return (current + 1) % count;
    case 'ArrowLeft':
    case 'ArrowUp':
      return (current - 1 + count) % count;
    case 'Home':
      return 0;
    case 'End':
      return count - 1;
    default:
      return null;
  }
}
