/** The page's team-server client and the hooks the screens share. */
import { useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { appDb } from '../app/db';
import { createApi, getSession, type Api } from '../sync/api';
import { syncAll, syncProject } from '../sync/engine';
import { syncStateOf } from '../sync/merge';
import { pendingCount } from '../sync/recordChange';

let api: Api | undefined;
export function teamApi(): Api {
  return (api ??= createApi(appDb()));
}

export function useSession() {
  return useQuery({ queryKey: ['session'], queryFn: () => getSession(appDb()) });
}

/** A project's link and sync state (polled: the engine worker records changes on its own connection). */
export function useSyncState(projectId: string) {
  return useQuery({
    queryKey: ['sync', projectId],
    queryFn: async () => {
      const db = appDb();
      const link = (await db.syncLinks.get(projectId)) ?? null;
      const pending = link ? await pendingCount(db, projectId) : 0;
      return { link, pending, state: syncStateOf(link ?? undefined, pending) };
    },
    refetchInterval: 3000,
  });
}

export function refreshAfterSync(qc: QueryClient) {
  for (const key of ['sync', 'projects', 'models', 'model', 'runs', 'session']) void qc.invalidateQueries({ queryKey: [key] });
}

let running: Promise<void> | null = null;
/** Sync every linked project now (one round at a time); quiet when signed out or offline. */
export async function syncNow(qc: QueryClient, projectId?: string): Promise<void> {
  if (typeof navigator !== 'undefined' && !navigator.onLine) return;
  if (!(await getSession(appDb()))) return;
  running ??= (async () => {
    try {
      if (projectId) await syncProject(appDb(), teamApi(), projectId);
      else await syncAll(appDb(), teamApi());
    } finally {
      running = null;
      refreshAfterSync(qc);
    }
  })();
  return running;
}

/** Sync on `online`, on an interval while online, and once at start. */
export function SyncRunner({ everyMs = 30_000 }: { everyMs?: number }) {
  const qc = useQueryClient();
  useEffect(() => {
    const go = () => void syncNow(qc).catch(() => undefined);
    window.addEventListener('online', go);
    const timer = window.setInterval(go, everyMs);
    go();
    return () => {
      window.removeEventListener('online', go);
      window.clearInterval(timer);
    };
  }, [qc, everyMs]);
  return null;
}
