import { useMutation, useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { appDb } from '../app/db';
import { linkProject } from '../sync/engine';
import { SYNC_STATE_LABEL, type SyncState } from '../sync/merge';
import { Button } from '../ui/Button';
import { refreshAfterSync, syncNow, teamApi, useSession, useSyncState } from './teamClient';

const TONE: Record<SyncState, string> = {
  local: 'bg-rule-soft text-ink-faint',
  'in-step': 'bg-glued-soft text-glued',
  ahead: 'bg-rule-soft text-ink',
  behind: 'bg-rule-soft text-ink',
  'at-odds': 'bg-odds-soft text-odds',
};

/** A project's sync state, In step · Ahead · Behind · At odds (nothing for local projects unless `showLocal`). */
export function SyncBadge({ projectId, showLocal = false }: { projectId: string; showLocal?: boolean }) {
  const s = useSyncState(projectId);
  const state = s.data?.state;
  if (!state || (state === 'local' && !showLocal)) return null;
  const title = s.data?.link?.lastError ? `last sync failed: ${s.data.link.lastError}` : s.data?.pending ? `${s.data.pending} change(s) to push` : undefined;
  const badge = (
    <span data-testid="sync-state" data-state={state} title={title} className={`rounded-full px-2 py-0.5 text-[11px] ${TONE[state]}`}>
      {SYNC_STATE_LABEL[state]}
    </span>
  );
  return state === 'at-odds' ? <Link to={`/p/${projectId}/conflicts`}>{badge}</Link> : badge;
}

/** Link / Sync now / Crew / Logbook for one project; nothing when signed out. */
export function ProjectSyncControls({ projectId }: { projectId: string }) {
  const qc = useQueryClient();
  const session = useSession();
  const s = useSyncState(projectId);
  const link = useMutation({
    mutationFn: () => linkProject(appDb(), teamApi(), projectId),
    onSettled: () => refreshAfterSync(qc),
  });
  const sync = useMutation({ mutationFn: () => syncNow(qc, projectId) });
  if (!session.data) return null;
  if (!s.data?.link) {
    return (
      <Button tone="quiet" disabled={link.isPending} onClick={() => link.mutate()} title={link.error ? String(link.error.message) : 'Share this project through the team server'}>
        {link.isPending ? 'Linking…' : 'Link to team'}
      </Button>
    );
  }
  return (
    <span className="flex items-center gap-1 text-xs">
      {s.data.link.role === 'viewer' && <span className="text-ink-faint" title="Viewers read the team's copy; local edits are not pushed">viewer</span>}
      <Button tone="quiet" disabled={sync.isPending} onClick={() => sync.mutate()}>
        {sync.isPending ? 'Syncing…' : 'Sync now'}
      </Button>
      <Link className="text-ink-soft hover:text-ink" to={`/p/${projectId}/crew`}>
        Crew
      </Link>
      <Link className="text-ink-soft hover:text-ink" to={`/p/${projectId}/logbook`}>
        Logbook
      </Link>
    </span>
  );
}

