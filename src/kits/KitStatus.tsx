import { ProblemList } from '../ui/ProblemList';
import type { KitState } from './useKitRun';

/** What a kit says while it is not showing a result: working, located problems, or a failure. */
export function KitStatus<T>({ state, what, note }: { state: KitState<T>; what: string; note?: string }) {
  if (state.status === 'running') return <p className="text-sm text-ink-soft" data-testid="kit-running">{note ?? 'Computing in the engine worker…'}</p>;
  if (state.status === 'cancelled')
    return (
      <p role="status" className="rounded border border-rule bg-rule-soft p-2 text-sm" data-testid="kit-cancelled">
        Cancelled. Nothing was kept; the engine worker starts afresh for the next computation.
      </p>
    );
  if (state.status === 'problems') return <ProblemList problems={state.problems} title={`${what} could not be read`} />;
  if (state.status === 'failed')
    return (
      <p role="alert" className="rounded border border-odds bg-odds-soft p-3 text-sm text-odds">
        {state.message}
      </p>
    );
  return null;
}
