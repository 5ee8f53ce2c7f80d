import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState, type DragEvent } from 'react';
import { demoReadingsModelNames, weatherStationReadings } from '../../shared/demo';
import type { Problem } from '../../shared/engine';
import type { Progress } from '../compute/computeService';
import type { CellRef, ReadingsCheck } from '../compute/readingsService';
import { download, stem } from '../kits/download';
import type { ReadingsRow } from '../store';
import { Button } from '../ui/Button';
import { ProblemList } from '../ui/ProblemList';
import { ProgressBar } from '../ui/ProgressBar';
import { checkReadingsThroughWorker, engine, RunCancelled } from '../workers/engineClient';
import { ReadingsCaution, ReadingsFindings } from './ReadingsFindings';
import { ReadingsShelf } from './ReadingsShelf';
import { useReadings } from './useModelData';

const ACCEPT = '.json,.csv,.tsv,.txt';

const PHASES: Record<string, string> = {
  read: 'Reading the model and the readings',
  radius: 'Consistency radius over the face pairs',
  section: 'Nearest global section',
  spectrum: 'Smallest eigenvalues of the sheaf Laplacian',
  done: 'Done',
};

export interface ReadingsPanelProps {
  modelId: string;
  modelName: string;
  readOnly: boolean;
  check?: ReadingsCheck;
  onCheck(check: ReadingsCheck | undefined): void;
  picked?: string;
  onPick(key: string | undefined, cells: CellRef[]): void;
}

/** Readings for the open model: import (picker or drop), the saved sets, and "Check readings" in the worker. */
export function ReadingsPanel({ modelId, modelName, readOnly, check, onCheck, picked, onPick }: ReadingsPanelProps) {
  const qc = useQueryClient();
  const readings = useReadings(modelId);
  const picker = useRef<HTMLInputElement>(null);
  const [selected, setSelected] = useState<string>();
  const [problems, setProblems] = useState<{ title: string; list: Problem[] }>();
  const [busy, setBusy] = useState<string>();
  const [progress, setProgress] = useState<Progress>();
  const [message, setMessage] = useState<string>();
  const [dragging, setDragging] = useState(false);
  const handle = useRef<{ cancel(): void } | null>(null);
  const list = readings.data ?? [];
  const current = list.find((r) => r.id === selected) ?? list[0];
  const demoFits = demoReadingsModelNames().includes(modelName);

  useEffect(() => {
    setSelected(undefined);
    setProblems(undefined);
    setMessage(undefined);
  }, [modelId]);

  // A deleted set takes its check (and the Sketch's colours) with it.
  useEffect(() => {
    if (check && readings.data && !readings.data.some((r) => r.id === check.readingsId)) onCheck(undefined);
  }, [check, readings.data, onCheck]);

  const importOne = async (name: string, data: string | Blob) => {
    if (readOnly) return;
    setProblems(undefined);
    setMessage(undefined);
    setBusy(name);
    try {
      const outcome = await engine().importReadings(modelId, name, data);
      if (!outcome.ok) setProblems({ title: `${name} was not imported; nothing saved was changed.`, list: outcome.problems });
      else {
        await qc.invalidateQueries({ queryKey: ['readings', modelId] });
        void qc.invalidateQueries({ queryKey: ['sync'] });
        setSelected(outcome.readings.id);
        setMessage(`Imported ${outcome.readings.count.toLocaleString('en')} readings from ${name}.`);
      }
    } catch (err) {
      setProblems({ title: `${name} was not imported; nothing saved was changed.`, list: [{ where: name, message: (err as Error).message }] });
    } finally {
      setBusy(undefined);
    }
  };
  const importFiles = async (files: FileList | File[]) => {
    for (const f of Array.from(files)) await importOne(f.name, f);
  };

  const start = useCallback(() => {
    if (handle.current || !current) return;
    setProblems(undefined);
    setMessage(undefined);
    setProgress({ phase: 'read', fraction: 0 });
    onCheck(undefined);
    const h = checkReadingsThroughWorker(modelId, current.id, (p) => {
      if (handle.current === h) setProgress(p);
    });
    handle.current = h;
    h.result
      .then((outcome) => {
        if (outcome.ok) onCheck(outcome.check);
        else setProblems({ title: `${current.name} no longer fits this model; check the cells named below.`, list: outcome.problems });
      })
      .catch((err) => setMessage(err instanceof RunCancelled ? 'Check cancelled.' : `The engine stopped: ${(err as Error).message}`))
      .finally(() => {
        handle.current = null;
        setProgress(undefined);
      });
  }, [current, modelId, onCheck]);

  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setDragging(false);
    if (e.dataTransfer.files.length && !readOnly) void importFiles(e.dataTransfer.files);
  };

  return (
    <section
      aria-label="Readings"
      className={`space-y-3 p-3 ${dragging ? 'outline-2 outline-glued outline-dashed' : ''}`}
      onDragOver={(e) => {
        e.preventDefault();
        if (!readOnly) setDragging(true);
      }}
      onDragLeave={() => setDragging(false)}
      onDrop={onDrop}
      data-testid="readings-panel"
    >
      <div className="flex items-center justify-between">
        <h2 className="text-xs font-semibold tracking-wide text-ink-soft uppercase">Readings</h2>
        <Button onClick={() => picker.current?.click()} disabled={readOnly || !!busy} title={readOnly ? 'Viewers cannot import readings into a team project' : undefined}>
          Import readings
        </Button>
        <input
          ref={picker}
          type="file"
          accept={ACCEPT}
          multiple
          hidden
          data-testid="readings-input"
          onChange={(e) => {
            if (e.target.files) void importFiles(e.target.files);
            e.target.value = '';
          }}
        />
      </div>
      {readOnly ? (
        <p className="text-[11px] text-ink-faint">Viewers can check and export the readings kept here, but not import, rename or delete them.</p>
      ) : (
        <p className="text-[11px] text-ink-faint">
          Drop a readings file here: <span className="num">gluefield.readings</span> JSON, or a CSV of <span className="num">cell,value,weight</span> rows (cell as vertex ids such as <span className="num">0-1</span>, value as coordinates such as <span className="num">1.2;-0.4</span>).
        </p>
      )}
      {busy && (
        <p data-testid="readings-importing" className="truncate text-xs">
          Reading and checking {busy} against the model…
        </p>
      )}
      {problems && <ProblemList title={problems.title} problems={problems.list} />}
      {readings.data && list.length === 0 && (
        <div className="space-y-2 rounded border border-dashed border-rule p-3 text-sm" data-testid="readings-empty">
          <p className="text-ink">No readings for this model yet.</p>
          <p className="text-xs text-ink-soft">Readings are measured values on some of the model’s cells. A check says how far they are from gluing into one global section, and which cells disagree.</p>
          <div className="flex flex-wrap gap-2">
            <Button onClick={() => void engine().readingsSample(modelId).then((text) => download(`${stem(modelName)}-readings-sample.csv`, text, 'text/csv'))} data-testid="readings-sample">
              Download a sample (CSV)
            </Button>
            {demoFits && (
              <Button onClick={() => void importOne('wind-week-3.readings.json', JSON.stringify(weatherStationReadings()))} disabled={readOnly} data-testid="readings-demo">
                Load the invented wind readings
              </Button>
            )}
          </div>
        </div>
      )}
      {list.length > 0 && <ReadingsShelf rows={list} selected={current?.id} onSelect={(r: ReadingsRow) => setSelected(r.id)} readOnly={readOnly} modelId={modelId} />}
      {current && (
        <div className="flex items-center gap-2">
          <Button tone="primary" onClick={start} disabled={!!progress} data-testid="readings-check">
            Check readings
          </Button>
          <Button onClick={() => handle.current?.cancel()} disabled={!progress} data-testid="readings-cancel">
            Cancel
          </Button>
        </div>
      )}
      {progress && (
        <div data-testid="readings-progress" aria-live="polite">
          <p className="mb-1 text-xs">{PHASES[progress.phase] ?? progress.phase}</p>
          <ProgressBar fraction={progress.fraction} label="readings check progress" />
        </div>
      )}
      {message && <p role="status" className="text-xs text-ink-soft">{message}</p>}
      {check && check.modelId === modelId ? <ReadingsFindings check={check} modelName={modelName} picked={picked} onPick={onPick} /> : <ReadingsCaution />}
    </section>
  );
}
