let last = 0;

/**
 * Milliseconds since the epoch, strictly increasing within this thread, so
 * rows saved in the same millisecond still sort in the order they were saved.
 */
export function stamp(): number {
  last = Math.max(Date.now(), last + 1);
  return last;
}
