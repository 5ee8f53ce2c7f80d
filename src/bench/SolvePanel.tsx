import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useMemo, useRef, useState } from 'react';
import type { FieldSpec } from '../../shared/engine';
import { useHotkeys } from '../app/useHotkeys';
import type { Progress, RunRecord } from '../compute/computeService';
import type { RunSettings } from '../store';
import { Button } from '../ui/Button';
import { Kbd } from '../ui/Kbd';
import { ProgressBar } from '../ui/ProgressBar';
import { RunCancelled, startRun, type RunHandle } from '../workers/engineClient';

const PHASES: Record<string, string> = {
  read: 'Reading the model',
  build: 'Building the complex',
  reduce: 'Morse reduction',
  solve: 'Solving the small complex',
  bases: 'Lifting bases to the cells',
  save: 'Saving the findings',
};

type FieldChoice = 'model' | 'rational' | 'real' | 'prime';

/** "Reduce & solve": settings, start, live progress by phase, cancel. */
export function SolvePanel({ modelId, modelField, onFinished, readOnly = false }: { modelId: string; modelField: string; onFinished(run: RunRecord): void; readOnly?: boolean }) {
  const qc = useQueryClient();
  const [choice, setChoice] = useState<FieldChoice>('model');
  const [prime, setPrime] = useState('32003');
  const [tolerance, setTolerance] = useState('1e-9');
  const [method, setMethod] = useState<'morse' | 'direct'>('morse');
  const [split, setSplit] = useState(true);
  const [progress, setProgress] = useState<Progress>();
  const [message, setMessage] = useState<string>();
  const handle = useRef<RunHandle>(null);

  const field = useMemo((): FieldSpec | string => {
    if (choice === 'model') return fieldFromLabel(modelField);
    if (choice === 'rational') return { kind: 'rational' };
    if (choice === 'real') {
      const t = Number(tolerance);
      return t > 0 && t < 1 ? { kind: 'real', tolerance: t } : 'Tolerance must be a number between 0 and 1.';
    }
    const p = Number(prime);
    return Number.isInteger(p) && p >= 2 && p < 2 ** 31 ? { kind: 'prime', p } : 'P must be a prime below 2^31.';
  }, [choice, modelField, prime, tolerance]);

  const start = useCallback(() => {
    if (handle.current || typeof field === 'string' || readOnly) return;
    const settings: RunSettings = { method, field, splitBlocks: split };
    setMessage(undefined);
    setProgress({ phase: 'read', fraction: 0 });
    // Progress arrives on its own message port and may trail the result: drop it once the run is over.
    const h = startRun(modelId, settings, (p) => {
      if (handle.current === h) setProgress(p);
    });
    handle.current = h;
    h.result
      .then((run) => {
        if (run.status === 'failed') setMessage(run.error ?? 'The run failed.');
        void qc.invalidateQueries({ queryKey: ['runs', modelId] });
        onFinished(run);
      })
      .catch((err) => setMessage(err instanceof RunCancelled ? 'Cancelled. Nothing was saved for this run.' : `The engine stopped: ${(err as Error).message}`))
      .finally(() => {
        handle.current = null;
        setProgress(undefined);
      });
  }, [field, method, split, modelId, qc, onFinished, readOnly]);
  const cancel = useCallback(() => handle.current?.cancel(), []);
  useHotkeys(useMemo(() => ({ 'mod+enter': start, escape: cancel }), [start, cancel]));

  const running = !!progress;
  return (
    <section aria-label="Reduce and solve" className="space-y-3 border-b border-rule p-3">
      <h2 className="text-xs font-semibold tracking-wide text-ink-soft uppercase">Reduce &amp; solve</h2>
      {readOnly && <p className="text-xs text-ink-soft">Viewers read the runs already made; a new run would be saved to the project.</p>}
      <div className="grid grid-cols-[5rem_1fr] items-center gap-x-2 gap-y-2 text-sm">
        <label htmlFor="solve-field">Field</label>
        <select id="solve-field" value={choice} onChange={(e) => setChoice(e.target.value as FieldChoice)} className="w-full min-w-0 rounded border border-rule bg-sheet px-1 py-0.5" disabled={running}>
          <option value="model">as in the model ({modelField})</option>
          <option value="rational">rational (exact)</option>
          <option value="prime">prime field GF(P)</option>
          <option value="real">real (floating point)</option>
        </select>
        {choice === 'prime' && (
          <>
            <label htmlFor="solve-p">P</label>
            <input id="solve-p" value={prime} onChange={(e) => setPrime(e.target.value)} className="num rounded border border-rule bg-sheet px-1 py-0.5" disabled={running} />
          </>
        )}
        {choice === 'real' && (
          <>
            <label htmlFor="solve-tol">Tolerance</label>
            <input id="solve-tol" value={tolerance} onChange={(e) => setTolerance(e.target.value)} className="num rounded border border-rule bg-sheet px-1 py-0.5" disabled={running} />
          </>
        )}
        <label htmlFor="solve-method">Method</label>
        <select id="solve-method" value={method} onChange={(e) => setMethod(e.target.value as 'morse' | 'direct')} className="w-full min-w-0 rounded border border-rule bg-sheet px-1 py-0.5" disabled={running}>
          <option value="morse">Morse reduction, then solve</option>
          <option value="direct">direct elimination (slow when large)</option>
        </select>
        <span />
        <label className="flex items-center gap-2 text-xs text-ink-soft">
          <input type="checkbox" checked={split} onChange={(e) => setSplit(e.target.checked)} disabled={running || method === 'direct'} />
          pair inside rank-deficient maps too
        </label>
      </div>
      {typeof field === 'string' && <p className="text-xs text-odds">{field}</p>}
      <div className="flex items-center gap-2">
        <Button tone="primary" onClick={start} disabled={running || typeof field === 'string' || readOnly} data-testid="solve-start" title={readOnly ? 'Viewers cannot run: a run is saved to the project' : undefined}>
          Reduce &amp; solve <Kbd>mod+enter</Kbd>
        </Button>
        <Button onClick={cancel} disabled={!running} data-testid="solve-cancel">
          Cancel <Kbd>esc</Kbd>
        </Button>
      </div>
      {progress && (
        <div data-testid="solve-progress" aria-live="polite">
          <p className="mb-1 text-xs">{PHASES[progress.phase] ?? progress.phase}</p>
          <ProgressBar fraction={progress.fraction} label="computation progress" />
        </div>
      )}
      {message && <p role="status" className="text-xs text-ink-soft">{message}</p>}
    </section>
  );
}

export function fieldFromLabel(label: string): FieldSpec {
  if (label.startsWith('prime:')) return { kind: 'prime', p: Number(label.slice(6)) };
  if (label === 'real') return { kind: 'real' };
  return { kind: 'rational' };
}
