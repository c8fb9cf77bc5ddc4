// Which live result the arrow keys land on: down from the box goes to the first, and the list wraps round.

/** -1 means no option is active (the cursor is in the box). */
export function nextActive(current: number, count: number, key: 'ArrowDown' | 'ArrowUp'): number {
  if (count <= 0) return -1;
  if (key === 'ArrowDown') return current < 0 || current >= count - 1 ? 0 : current + 1;
  return current <= 0 ? count - 1 : current - 1;
}
