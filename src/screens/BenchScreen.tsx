import { useQuery } from '@tanstack/react-query';
import { lazy, Suspense, useCallback, useMemo, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { appDb } from '../app/db';
import { useHotkeys } from '../app/useHotkeys';
import { CellLedger, type LedgerValues } from '../bench/CellLedger';
import { Findings, type BasisChoice } from '../bench/Findings';
import { KitShelf } from '../bench/KitShelf';
import { ModelShelf } from '../bench/ModelShelf';
import { ReadingsPanel } from '../bench/ReadingsPanel';
import { RunHistory } from '../bench/RunHistory';
import { SavedKitResult } from '../bench/SavedKitResult';
import { Sketch, type SketchPaint } from '../bench/Sketch';
import { SolvePanel } from '../bench/SolvePanel';
import { useModel, useRuns, useSketch } from '../bench/useModelData';
import type { RunRecord } from '../compute/computeService';
import type { CellRef, ReadingsCheck } from '../compute/readingsService';
import { listProjects } from '../store';
import { ReadOnlyBanner, useReadOnly } from '../team/ReadOnlyBanner';
import { ProjectSyncControls, SyncBadge } from '../team/SyncBadge';
import { Kbd } from '../ui/Kbd';
import { engine } from '../workers/engineClient';

type Tab = 'sketch' | 'ledger' | 'editor';
type Side = 'solve' | 'readings';

// The editor brings the expression parser; load it only when someone edits.
const MapsEditor = lazy(() => import('../editor/MapsEditor').then((m) => ({ default: m.MapsEditor })));

/** The bench: one project's models, the open model's views, and its runs. */
export function BenchScreen() {
  const { projectId = '', modelId, kitResultId } = useParams();
  const projects = useQuery({ queryKey: ['projects'], queryFn: () => listProjects(appDb()) });
  const project = projects.data?.find((p) => p.id === projectId);
  const model = useModel(modelId);
  const runs = useRuns(modelId);
  const [tab, setTab] = useState<Tab>('sketch');
  const [runId, setRunId] = useState<string>();
  const [chosen, setChosen] = useState<BasisChoice>();
  const [side, setSide] = useState<Side>('solve');
  const [check, setCheck] = useState<ReadingsCheck>();
  const [picked, setPicked] = useState<{ key: string; cells: CellRef[] }>();
  const viewer = useReadOnly(projectId);
  const readOnly = viewer !== false;
  useHotkeys(useMemo(() => ({ '1': () => setTab('sketch'), '2': () => setTab('ledger'), '3': () => setTab('editor') }), []));

  const run: RunRecord | undefined = (runs.data as RunRecord[] | undefined)?.find((r) => r.id === runId) ?? (runs.data?.[0] as RunRecord | undefined);
  const m = model.data?.id === modelId ? model.data : undefined;
  const sketch = useSketch(m?.id, m?.version);
  const basis = chosen && run?.bases?.find((b) => b.degree === chosen.degree);
  const stalks = useQuery({
    queryKey: ['stalks', m?.id, m?.version, chosen?.degree],
    queryFn: () => engine().stalks(m!.id, chosen!.degree),
    enabled: !!m && !!chosen,
  });
  const ledgerValues: LedgerValues | undefined =
    basis && chosen && stalks.data ? { degree: chosen.degree, values: basis.values[chosen.index], offsets: offsetsOf(stalks.data), label: `H^${chosen.degree} #${chosen.index + 1}` } : undefined;
  const freshCheck = check && m && check.modelId === m.id && check.modelVersion === m.version ? check : undefined;
  const readingsPaint = useMemo((): SketchPaint | undefined => {
    if (!freshCheck || !m) return undefined;
    const values = m.cells.map((n) => new Float64Array(n).fill(NaN));
    let max = 0;
    for (const c of freshCheck.cells) {
      values[c.cell.degree][c.cell.index] = c.norm;
      max = Math.max(max, c.norm);
    }
    return { shade: { values, max, label: 'residual ‖r‖ against the nearest global section' }, highlight: picked?.cells.map((c) => ({ degree: c.degree, index: c.index })) };
  }, [freshCheck, m, picked]);
  const onCheck = useCallback((c: ReadingsCheck | undefined) => {
    setCheck(c);
    setPicked(undefined);
  }, []);
  const onPick = useCallback((key: string | undefined, cells: CellRef[]) => {
    setPicked(key ? { key, cells } : undefined);
    if (key) setTab('sketch');
  }, []);
  const paint: SketchPaint = useMemo(() => {
    const fresh = run && m && run.modelVersion === m.version ? run : undefined;
    const p: SketchPaint = { critical: fresh?.critical };
    if (ledgerValues && ledgerValues.degree === 0 && fresh) {
      const v = new Float64Array(ledgerValues.offsets.length - 1);
      for (let i = 0; i < v.length; i++) v[i] = ledgerValues.offsets[i + 1] > ledgerValues.offsets[i] ? ledgerValues.values[ledgerValues.offsets[i]] : 0;
      p.vertexValues = v;
    }
    return p;
  }, [run, m, ledgerValues]);

  return (
    <div className="grid h-full grid-cols-[15rem_1fr_23rem]">
      <div className="flex min-h-0 flex-col">
        <div className="min-h-0 flex-1">
          <ModelShelf projectId={projectId} modelId={modelId} readOnly={readOnly} />
        </div>
        <KitShelf projectId={projectId} selected={kitResultId} />
      </div>
      <section className="flex min-w-0 flex-col">
        <div className="no-print flex items-center gap-1 border-b border-rule bg-sheet px-3 py-1.5">
          <Link to="/" className="text-xs text-ink-faint hover:text-ink">
            Desk
          </Link>
          <span className="text-xs text-ink-faint">/</span>
          <span className="text-xs">{project?.name ?? '…'}</span>
          <span className="ml-2 flex items-center gap-1">
            <SyncBadge projectId={projectId} />
            <ProjectSyncControls projectId={projectId} />
          </span>
          {m && (
            <>
              <span className="text-xs text-ink-faint">/</span>
              <span className="text-xs font-medium" data-testid="model-name">
                {m.name}
              </span>
            </>
          )}
          <div className="ml-auto flex gap-1" role="tablist">
            {(
              [
                ['sketch', 'Sketch', '1'],
                ['ledger', 'Cell ledger', '2'],
                ['editor', 'Stalks & maps', '3'],
              ] as const
            ).map(([id, label, key]) => (
              <button key={id} role="tab" aria-selected={tab === id} onClick={() => setTab(id)} className={`rounded px-2 py-0.5 text-sm ${tab === id ? 'bg-ink text-paper' : 'hover:bg-rule-soft'}`}>
                {label} <Kbd>{key}</Kbd>
              </button>
            ))}
          </div>
        </div>
        {viewer === true && <ReadOnlyBanner />}
        <div className="min-h-0 flex-1">
          {kitResultId && <SavedKitResult key={kitResultId} projectId={projectId} id={kitResultId} />}
          {!modelId && !kitResultId && <EmptyBench readOnly={viewer === true} />}
          {modelId && !m && <p className="p-4 text-ink-soft">Opening the model…</p>}
          {m && tab === 'sketch' && (sketch.data ? <Sketch data={sketch.data} paint={side === 'readings' && readingsPaint ? readingsPaint : paint} /> : <p className="p-4 text-ink-soft">Drawing…</p>)}
          {m && tab === 'ledger' && <CellLedger modelId={m.id} version={m.version} cells={m.cells} critical={run?.modelVersion === m.version ? run?.critical : undefined} values={ledgerValues} />}
          {m && tab === 'editor' && (
            <Suspense fallback={<p className="p-4 text-ink-soft">Opening the editor…</p>}>
              <MapsEditor model={m} readOnly={readOnly} />
            </Suspense>
          )}
        </div>
      </section>
      <aside className="flex min-h-0 min-w-0 flex-col overflow-x-hidden overflow-y-auto border-l border-rule bg-sheet">
        {m ? (
          <>
            <div className="no-print flex gap-1 border-b border-rule px-3 py-1.5" role="tablist" aria-label="Side panels">
              {(
                [
                  ['solve', 'Reduce & solve'],
                  ['readings', 'Readings'],
                ] as const
              ).map(([id, label]) => (
                <button key={id} role="tab" aria-selected={side === id} onClick={() => setSide(id)} className={`rounded px-2 py-0.5 text-sm ${side === id ? 'bg-ink text-paper' : 'hover:bg-rule-soft'}`}>
                  {label}
                </button>
              ))}
            </div>
            {/* Both stay mounted, so a run or a check in progress keeps its progress and cancel when the other panel is shown. */}
            <div hidden={side !== 'solve'}>
              <SolvePanel modelId={m.id} modelField={m.field} onFinished={(r) => setRunId(r.id)} readOnly={readOnly} />
              {run ? <Findings run={run} modelName={m.name} chosen={chosen} onChoose={setChosen} /> : null}
              <RunHistory runs={(runs.data ?? []) as RunRecord[]} selected={run?.id} onSelect={setRunId} />
            </div>
            <div hidden={side !== 'readings'}>
              <ReadingsPanel modelId={m.id} modelName={m.name} readOnly={readOnly} check={freshCheck} onCheck={onCheck} picked={picked?.key} onPick={onPick} />
            </div>
          </>
        ) : (
          <p className="p-4 text-sm text-ink-soft">Open a model to reduce and solve it.</p>
        )}
      </aside>
    </div>
  );
}

function EmptyBench({ readOnly }: { readOnly: boolean }) {
  return (
    <div className="flex h-full items-center justify-center text-center text-ink-soft">
      <div>
        <p className="mb-1 text-ink">No model open.</p>
        <p className="text-sm">
          {readOnly ? (
            'Pick one on the left to read it.'
          ) : (
            <>
              Pick one on the left, or import a file (<Kbd>i</Kbd>) — a model file, a CSV of simplices, or an OBJ/OFF mesh.
            </>
          )}
        </p>
      </div>
    </div>
  );
}

function offsetsOf(dims: Int32Array): Int32Array {
  const off = new Int32Array(dims.length + 1);
  for (let i = 0; i < dims.length; i++) off[i + 1] = off[i] + dims[i];
  return off;
}
