import { useCallback, useState } from 'react';

/** A value with an undo and a redo stack (bounded), for editors. */
export function useUndoable<T>(initial: T, limit = 200) {
  const [state, setState] = useState({ past: [] as T[], present: initial, future: [] as T[] });
  const set = useCallback(
    (next: T) => setState((s) => (Object.is(next, s.present) ? s : { past: [...s.past, s.present].slice(-limit), present: next, future: [] })),
    [limit],
  );
  const undo = useCallback(() => setState((s) => (s.past.length ? { past: s.past.slice(0, -1), present: s.past[s.past.length - 1], future: [s.present, ...s.future] } : s)), []);
  const redo = useCallback(() => setState((s) => (s.future.length ? { past: [...s.past, s.present], present: s.future[0], future: s.future.slice(1) } : s)), []);
  const reset = useCallback((value: T) => setState({ past: [], present: value, future: [] }), []);
  return { value: state.present, set, undo, redo, reset, canUndo: state.past.length > 0, canRedo: state.future.length > 0 };
}
