import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import type { ProjectView } from '../../shared/api/types';
import { appDb } from '../app/db';
import { openRemoteProject } from '../sync/engine';
import { Button } from '../ui/Button';
import { refreshAfterSync, teamApi, useSession } from './teamClient';

/** The team projects you belong to that are not on this machine yet (signed in and online only). */
export function TeamProjects() {
  const session = useSession();
  const qc = useQueryClient();
  const navigate = useNavigate();
  const remote = useQuery({
    queryKey: ['team-projects', session.data?.user.id],
    queryFn: async () => {
      const { projects } = await teamApi().request<{ projects: ProjectView[] }>('GET', '/api/projects');
      const linked = new Set((await appDb().syncLinks.toArray()).map((l) => l.remoteId));
      return projects.filter((p) => !linked.has(p.id));
    },
    enabled: !!session.data,
    retry: false,
  });
  const open = useMutation({
    mutationFn: (p: ProjectView) => openRemoteProject(appDb(), teamApi(), p),
    onSuccess: (id) => {
      refreshAfterSync(qc);
      void qc.invalidateQueries({ queryKey: ['team-projects'] });
      navigate(`/p/${id}`);
    },
  });
  if (!session.data || !remote.data?.length) return null;
  return (
    <section className="mt-6">
      <h2 className="mb-2 text-sm font-semibold text-ink-soft">On the team server</h2>
      <ul className="divide-y divide-rule-soft rounded border border-rule bg-sheet">
        {remote.data.map((p) => (
          <li key={p.id} className="flex items-center gap-3 px-4 py-2 text-sm">
            <span className="flex-1">{p.name}</span>
            <span className="text-xs text-ink-faint">{p.role}</span>
            <Button disabled={open.isPending} onClick={() => open.mutate(p)} aria-label={`Open ${p.name} here`}>
              Bring here
            </Button>
          </li>
        ))}
      </ul>
      {open.error && <p role="alert" className="mt-2 text-sm text-odds">{open.error.message}</p>}
    </section>
  );
}
