import { useQueryClient } from '@tanstack/react-query';
import { useRef, useState, type DragEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { Problem } from '../../shared/engine';
import { appDb } from '../app/db';
import { useHotkeys } from '../app/useHotkeys';
import type { Progress } from '../compute/computeService';
import { deleteModel, loadModelText, renameModel, type ModelRow } from '../store';
import { recordModelDeleted, recordModelSaved } from '../sync/recordChange';
import { useSyncState } from '../team/teamClient';
import { Button } from '../ui/Button';
import { ConfirmDialog } from '../ui/ConfirmDialog';
import { Kbd } from '../ui/Kbd';
import { ProblemList } from '../ui/ProblemList';
import { ProgressBar } from '../ui/ProgressBar';
import { RenameForm } from '../ui/RenameForm';
import { importThroughWorker } from '../workers/engineClient';
import { useModels } from './useModelData';

const ACCEPT = '.json,.csv,.tsv,.txt,.obj,.off';

/** The project's models, with import by picker or drag-and-drop and export. */
export function ModelShelf({ projectId, modelId, readOnly = false }: { projectId: string; modelId?: string; readOnly?: boolean }) {
  const models = useModels(projectId);
  const qc = useQueryClient();
  const navigate = useNavigate();
  const picker = useRef<HTMLInputElement>(null);
  const [progress, setProgress] = useState<Progress & { file: string }>();
  const [problems, setProblems] = useState<{ file: string; list: Problem[] }>();
  const [dragging, setDragging] = useState(false);
  const [doomed, setDoomed] = useState<ModelRow>();
  const [renaming, setRenaming] = useState<string>();
  const linked = !!useSyncState(projectId).data?.link;
  useHotkeys({ i: () => !readOnly && picker.current?.click() });

  const importFiles = async (files: FileList | File[]) => {
    for (const file of Array.from(files)) {
      setProblems(undefined);
      setProgress({ phase: 'read', fraction: 0, file: file.name });
      // Progress arrives on its own message port and may trail the outcome: drop it once this import is over.
      let live = true;
      try {
        const outcome = await importThroughWorker(projectId, file, (p) => {
          if (live) setProgress({ ...p, file: file.name });
        });
        if (!outcome.ok) {
          setProblems({ file: file.name, list: outcome.problems });
        } else {
          await qc.invalidateQueries({ queryKey: ['models', projectId] });
          navigate(`/p/${projectId}/m/${outcome.model.id}`);
        }
      } catch (err) {
        setProblems({ file: file.name, list: [{ where: file.name, message: (err as Error).message }] });
      } finally {
        live = false;
        setProgress(undefined);
      }
    }
  };

  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setDragging(false);
    if (e.dataTransfer.files.length && !readOnly) void importFiles(e.dataTransfer.files);
  };

  return (
    <section
      aria-label="Models"
      onDragOver={(e) => {
        e.preventDefault();
        if (!readOnly) setDragging(true);
      }}
      onDragLeave={() => setDragging(false)}
      onDrop={onDrop}
      className={`flex h-full flex-col gap-3 border-r border-rule bg-sheet p-3 ${dragging ? 'outline-2 outline-glued outline-dashed' : ''}`}
    >
      <div className="flex items-center justify-between">
        <h2 className="text-xs font-semibold tracking-wide text-ink-soft uppercase">Models</h2>
        <Button onClick={() => picker.current?.click()} disabled={readOnly} title={readOnly ? 'Viewers cannot import into a team project' : undefined}>
          Import <Kbd>i</Kbd>
        </Button>
        <input
          ref={picker}
          type="file"
          accept={ACCEPT}
          multiple
          hidden
          data-testid="import-input"
          onChange={(e) => {
            if (e.target.files) void importFiles(e.target.files);
            e.target.value = '';
          }}
        />
      </div>
      {!readOnly && <p className="text-[11px] text-ink-faint">Drop a model file (.sheaf.json), a CSV of simplices or an OBJ/OFF mesh here.</p>}
      {progress && (
        <div data-testid="import-progress">
          <p className="mb-1 truncate text-xs">Importing {progress.file} · {progress.phase}</p>
          <ProgressBar fraction={progress.fraction} />
        </div>
      )}
      {problems && <ProblemList title={`${problems.file} was not imported; nothing saved was changed.`} problems={problems.list} />}
      {models.data?.length === 0 && <p className="text-sm text-ink-soft">{readOnly ? 'No models in this project yet.' : 'No models yet. Import one to begin.'}</p>}
      <ul className="min-h-0 flex-1 space-y-1 overflow-auto">
        {models.data?.map((m) => (
          <li key={m.id} className={`group rounded px-2 py-1.5 ${m.id === modelId ? 'bg-glued-soft' : 'hover:bg-rule-soft'}`}>
            {renaming === m.id ? (
              <RenameForm
                initial={m.name}
                label="Model name"
                save={async (name) => {
                  await recordModelSaved(appDb(), await renameModel(appDb(), m.id, name));
                }}
                onDone={() => {
                  setRenaming(undefined);
                  void qc.invalidateQueries({ queryKey: ['models', projectId] });
                  void qc.invalidateQueries({ queryKey: ['model', m.id] });
                  void qc.invalidateQueries({ queryKey: ['sync', projectId] });
                }}
              />
            ) : (
              <Link to={`/p/${projectId}/m/${m.id}`} className="block">
                <span className="block truncate text-sm font-medium">{m.name}</span>
                <span className="num block text-[11px] text-ink-faint">
                  {m.cells.reduce((a, b) => a + b, 0).toLocaleString()} cells · {m.field} · v{m.version}
                </span>
              </Link>
            )}
            <div className="mt-1 hidden gap-1 group-hover:flex group-focus-within:flex">
              <Button tone="quiet" className="text-xs" onClick={() => void exportModel(m)}>
                Export
              </Button>
              {!readOnly && (
                <>
                  <Button tone="quiet" className="text-xs" onClick={() => setRenaming(m.id)} aria-label={`Rename ${m.name}`}>
                    Rename
                  </Button>
                  <Button tone="quiet" className="text-xs" onClick={() => setDoomed(m)} aria-label={`Delete ${m.name}`}>
                    Delete
                  </Button>
                </>
              )}
            </div>
          </li>
        ))}
      </ul>
      <ConfirmDialog
        open={!!doomed}
        title={`Delete “${doomed?.name}”?`}
        body={linked ? 'All its versions, runs and readings are removed from this machine, and the model from the team project at the next sync.' : 'All its versions, runs and readings are removed from this machine.'}
        confirm="Delete model"
        onClose={() => setDoomed(undefined)}
        onConfirm={() => {
          const m = doomed;
          setDoomed(undefined);
          if (m)
            void (async () => {
              await deleteModel(appDb(), m.id);
              await recordModelDeleted(appDb(), m);
              void qc.invalidateQueries({ queryKey: ['models', projectId] });
              void qc.invalidateQueries({ queryKey: ['sync', projectId] });
              if (m.id === modelId) navigate(`/p/${projectId}`);
            })();
        }}
      />
    </section>
  );
}

async function exportModel(m: ModelRow) {
  const text = await loadModelText(appDb(), m.id);
  download(`${m.name.replace(/[^\w.-]+/g, '_')}.sheaf.json`, text, 'application/json');
}

export function download(name: string, text: string, type: string) {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
