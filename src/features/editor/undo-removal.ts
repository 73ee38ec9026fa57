import { useRef } from 'react';

/**
 * The list with a removed item put back where it was, counted in the list as it
 * is now (edits made since the removal are kept); at the end when the list has
 * grown shorter than that place, and unchanged when the item is already back.
 */
export function restoreAt<T>(current: readonly T[], item: T, index: number): T[] {
  if (current.includes(item)) return [...current];
  const at = Math.min(Math.max(index, 0), current.length);
  return [...current.slice(0, at), item, ...current.slice(at)];
}

/** A ref that always holds the latest value, for an Undo that runs after later edits. */
export function useLatest<T>(value: T) {
  const ref = useRef(value);
  // eslint-disable-next-line react-hooks/refs -- written during render on purpose: an Undo reads the latest value later, outside render
  ref.current = value;
  return ref;
}
