import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { appDb } from '../app/db';
import { listProjects, type KitKind } from '../store';
import { engine } from '../workers/engineClient';
import { Button } from '../ui/Button';

/** What a kit hands over to be kept in a project. */
export interface KitSave {
  kit: KitKind;
  name: string;
  summary: string;
  settings: Record<string, unknown>;
  /** The files as text, or as the picked Blob (a large mesh is then read in the worker, not here). */
  inputs: { name: string; data: string | Blob }[];
  report: unknown;
}

type SaveState = { status: 'idle' } | { status: 'saving' } | { status: 'saved'; projectId: string; projectName: string } | { status: 'failed'; message: string };

/** Pick a project on the Desk and keep the kit's input files and report there, with the engine version and time. */
export function SaveToProject({ save }: { save: KitSave }) {
  const qc = useQueryClient();
  const projects = useQuery({ queryKey: ['projects'], queryFn: () => listProjects(appDb()) });
  const [projectId, setProjectId] = useState('');
  const [state, setState] = useState<SaveState>({ status: 'idle' });
  // A new result is not saved yet, whatever happened to the last one.
  useEffect(() => setState({ status: 'idle' }), [save.report]);
  const chosen = projectId || projects.data?.[0]?.id || '';
  const run = async () => {
    const project = projects.data?.find((p) => p.id === chosen);
    if (!project) return;
    setState({ status: 'saving' });
    try {
      await engine().saveKitResult({ projectId: project.id, kit: save.kit, name: save.name, summary: save.summary, settings: save.settings, inputs: save.inputs, report: save.report });
      await qc.invalidateQueries({ queryKey: ['kitResults', project.id] });
      await qc.invalidateQueries({ queryKey: ['projects'] });
      setState({ status: 'saved', projectId: project.id, projectName: project.name });
    } catch (err) {
      setState({ status: 'failed', message: err instanceof Error ? err.message : String(err) });
    }
  };
  if (projects.data?.length === 0) return <p className="text-xs text-ink-soft">Create a project on the Desk to keep this result.</p>;
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm" data-testid="kit-save">
      <label className="flex items-center gap-1">
        <span className="text-xs text-ink-soft">Keep in project</span>
        <select aria-label="Project to keep the result in" className="rounded border border-rule bg-sheet px-2 py-0.5" value={chosen} onChange={(e) => setProjectId(e.target.value)}>
          {projects.data?.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </select>
      </label>
      <Button onClick={() => void run()} disabled={!chosen || state.status === 'saving'} data-testid="kit-save-button">
        {state.status === 'saving' ? 'Saving…' : 'Save to project'}
      </Button>
      {state.status === 'saved' && (
        <span role="status" className="text-xs text-glued" data-testid="kit-saved">
          Saved to{' '}
          <Link className="underline" to={`/p/${state.projectId}`}>
            {state.projectName}
          </Link>
        </span>
      )}
      {state.status === 'failed' && (
        <span role="alert" className="text-xs text-odds">
          Not saved: {state.message}
        </span>
      )}
    </div>
  );
}
