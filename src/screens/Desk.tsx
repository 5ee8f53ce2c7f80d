import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRef, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { appDb } from '../app/db';
import { useHotkeys } from '../app/useHotkeys';
import { createProject, deleteProject, listModels, listProjects, renameProject, type ProjectRow } from '../store';
import { unlinkProject } from '../sync/engine';
import { recordProjectRenamed } from '../sync/recordChange';
import { useReadOnly } from '../team/ReadOnlyBanner';
import { ProjectSyncControls, SyncBadge } from '../team/SyncBadge';
import { TeamProjects } from '../team/TeamProjects';
import { Button } from '../ui/Button';
import { ConfirmDialog } from '../ui/ConfirmDialog';
import { Kbd } from '../ui/Kbd';

/** The desk: every project on this machine. */
export function Desk() {
  const db = appDb();
  const qc = useQueryClient();
  const navigate = useNavigate();
  const projects = useQuery({ queryKey: ['projects'], queryFn: () => listProjects(db) });
  const [name, setName] = useState('');
  const [error, setError] = useState<string>();
  const [doomed, setDoomed] = useState<ProjectRow>();
  const input = useRef<HTMLInputElement>(null);
  useHotkeys({ n: () => input.current?.focus() });

  const create = useMutation({
    mutationFn: (n: string) => createProject(db, n),
    onSuccess: (p) => {
      setName('');
      void qc.invalidateQueries({ queryKey: ['projects'] });
      navigate(`/p/${p.id}`);
    },
    onError: (e: Error) => setError(e.message),
  });
  const remove = useMutation({
    // Deleting the local copy stops syncing it; the team's copy stays on the server.
    mutationFn: async (id: string) => {
      await deleteProject(db, id);
      await unlinkProject(db, id);
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: ['projects'] }),
  });

  return (
    <div className="mx-auto max-w-4xl p-6">
      <div className="mb-5 flex items-end justify-between">
        <div>
          <h1 className="text-xl font-semibold">Desk</h1>
          <p className="text-sm text-ink-soft">Projects kept on this machine. Everything works without a network.</p>
        </div>
        <form
          className="flex items-center gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            setError(undefined);
            if (!name.trim()) return setError('Give the project a name.');
            create.mutate(name.trim());
          }}
        >
          <input
            ref={input}
            aria-label="New project name"
            value={name}
            onChange={(e) => setName(e.target.value)}
            placeholder="New project name"
            className="w-56 rounded border border-rule bg-sheet px-2 py-1"
          />
          <Button tone="primary" type="submit">
            Create <Kbd>n</Kbd>
          </Button>
        </form>
      </div>
      {error && <p role="alert" className="mb-3 text-sm text-odds">{error}</p>}
      {projects.isLoading && <p className="text-ink-soft">Opening the desk…</p>}
      {projects.data?.length === 0 && (
        <div className="rounded border border-dashed border-rule p-10 text-center text-ink-soft">
          <p className="mb-1 text-ink">No projects yet.</p>
          <p>Create one above, then import a model file, a CSV of simplices or an OBJ/OFF mesh.</p>
        </div>
      )}
      <ul className="divide-y divide-rule-soft rounded border border-rule bg-sheet">
        {projects.data?.map((p) => <ProjectItem key={p.id} project={p} onDelete={() => setDoomed(p)} />)}
      </ul>
      <TeamProjects />
      <ConfirmDialog
        open={!!doomed}
        title={`Delete “${doomed?.name}”?`}
        body="Its models, versions and runs are removed from this machine. This cannot be undone."
        confirm="Delete project"
        onClose={() => setDoomed(undefined)}
        onConfirm={() => {
          if (doomed) remove.mutate(doomed.id);
          setDoomed(undefined);
        }}
      />
    </div>
  );
}

function ProjectItem({ project, onDelete }: { project: ProjectRow; onDelete(): void }) {
  const db = appDb();
  const qc = useQueryClient();
  const models = useQuery({ queryKey: ['models', project.id], queryFn: () => listModels(db, project.id) });
  const [editing, setEditing] = useState(false);
  const [name, setName] = useState(project.name);
  const readOnly = useReadOnly(project.id) !== false;
  const rename = useMutation({
    mutationFn: async (n: string) => {
      const p = await renameProject(db, project.id, n);
      await recordProjectRenamed(db, p);
      return p;
    },
    onSuccess: () => {
      setEditing(false);
      void qc.invalidateQueries({ queryKey: ['projects'] });
      void qc.invalidateQueries({ queryKey: ['sync', project.id] });
    },
  });
  const renameError = rename.error?.message;
  return (
    <li className="flex items-center gap-3 px-4 py-3">
      {editing ? (
        <form
          className="flex flex-1 gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (name.trim()) rename.mutate(name.trim());
          }}
        >
          <input aria-label="Project name" autoFocus value={name} onChange={(e) => setName(e.target.value)} onKeyDown={(e) => e.key === 'Escape' && setEditing(false)} className="flex-1 rounded border border-rule bg-paper px-2 py-1" />
          <Button type="submit">Save</Button>
          {renameError && <span role="alert" className="text-xs text-odds">{renameError}</span>}
        </form>
      ) : (
        <Link to={`/p/${project.id}`} className="flex-1">
          <span className="font-medium">{project.name}</span>
          <span className="ml-3 text-xs text-ink-faint">
            {models.data ? `${models.data.length} model${models.data.length === 1 ? '' : 's'}` : ''} · changed {new Date(project.updatedAt).toLocaleString()}
          </span>
        </Link>
      )}
      <SyncBadge projectId={project.id} />
      <ProjectSyncControls projectId={project.id} />
      {!editing && !readOnly && (
        <Button tone="quiet" onClick={() => setEditing(true)} aria-label={`Rename ${project.name}`}>
          Rename
        </Button>
      )}
      <Button tone="quiet" onClick={onDelete} aria-label={`Delete ${project.name}`}>
        Delete
      </Button>
    </li>
  );
}
