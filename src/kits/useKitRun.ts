import { useCallback, useRef, useState } from 'react';
import type { Problem } from '../../shared/engine';
import type { KitOutcome } from '../compute/kitService';
import { RunCancelled } from '../workers/engineClient';

export type KitState<T> =
  | { status: 'idle' }
  | { status: 'running' }
  | { status: 'done'; result: T }
  | { status: 'problems'; problems: Problem[] }
  | { status: 'failed'; message: string }
  | { status: 'cancelled' };

/** Run one kit computation at a time; a later start supersedes an earlier one still in flight. */
export function useKitRun<T>() {
  const [state, setState] = useState<KitState<T>>({ status: 'idle' });
  const generation = useRef(0);
  const start = useCallback((run: () => Promise<KitOutcome<T>>) => {
    const mine = ++generation.current;
    setState({ status: 'running' });
    run().then(
      (out) => {
        if (mine !== generation.current) return;
        setState(out.ok ? { status: 'done', result: out.result } : { status: 'problems', problems: out.problems });
      },
      (err: unknown) => {
        if (mine !== generation.current) return;
        setState(err instanceof RunCancelled ? { status: 'cancelled' } : { status: 'failed', message: err instanceof Error ? err.message : String(err) });
      },
    );
  }, []);
  return { state, start };
}
