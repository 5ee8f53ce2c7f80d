import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import type { MembersResponse } from '../../shared/api/types';
import type { Resolution } from '../../shared/sync/types';
import { appDb } from '../app/db';
import { serverSummary } from '../sync/docs';
import { settleConflict } from '../sync/engine';
import type { DocSummary, StoredConflict } from '../sync/rows';
import { Button } from '../ui/Button';
import { refreshAfterSync, syncNow, teamApi, useSyncState } from './teamClient';

const REASON: Record<StoredConflict['reason'], string> = {
  stale: 'changed on the team server since you last synced',
  'unknown-base': 'the server does not have the version you edited',
  'kind-mismatch': 'the server holds another kind of document under this id',
};

/** Every unsettled conflict of a project, both sides, and three ways out. Nothing is overwritten until you choose. */
export function ConflictsScreen() {
  const { projectId = '' } = useParams();
  const s = useSyncState(projectId);
  const link = s.data?.link;
  const members = useQuery({
    queryKey: ['members', link?.remoteId],
    queryFn: () => teamApi().request<MembersResponse>('GET', `/api/projects/${link!.remoteId}/members`),
    enabled: !!link,
    retry: false,
  });
  const whoById = (id: string) => members.data?.members.find((m) => m.userId === id)?.name ?? id.slice(0, 8);
  return (
    <div className="mx-auto max-w-5xl p-6">
      <p className="mb-2 text-xs text-ink-faint">
        <Link to={`/p/${projectId}`} className="hover:text-ink">
          Back to the bench
        </Link>
      </p>
      <h1 className="mb-4 text-xl font-semibold">At odds</h1>
      {link && link.conflicts.length === 0 && <p className="text-ink-soft">No conflicts: this project is settled.</p>}
      <ul className="flex flex-col gap-4">
        {link?.conflicts.map((c) => <ConflictCard key={c.docId} projectId={projectId} conflict={c} theirs={serverSummary(c.server, whoById)} />)}
      </ul>
    </div>
  );
}

function ConflictCard({ projectId, conflict, theirs }: { projectId: string; conflict: StoredConflict; theirs: DocSummary | null }) {
  const qc = useQueryClient();
  const settle = useMutation({
    mutationFn: async (choice: Resolution) => {
      await settleConflict(appDb(), teamApi(), projectId, conflict.docId, choice);
      await syncNow(qc, projectId).catch(() => undefined);
    },
    onSettled: () => refreshAfterSync(qc),
  });
  // A deletion has no content to keep as a copy.
  const canKeepBoth = (conflict.kind === 'model' || conflict.kind === 'run' || conflict.kind === 'readings') && !conflict.mine.deleted;
  return (
    <li data-testid="conflict" className="rounded border border-odds bg-sheet p-4">
      <p className="mb-3 text-sm">
        <span className="font-medium">{conflict.kind}</span> <span className="num text-ink-faint">{conflict.docId}</span> — {REASON[conflict.reason]}
      </p>
      <div className="grid grid-cols-2 gap-4">
        <Side title="Mine (this machine)" s={conflict.mineSummary} testId="conflict-mine" />
        <Side title="Theirs (team server)" s={theirs} testId="conflict-theirs" />
      </div>
      <div className="mt-3 flex gap-2">
        <Button tone="primary" disabled={settle.isPending} onClick={() => settle.mutate('keep-mine')}>
          Keep mine
        </Button>
        <Button disabled={settle.isPending} onClick={() => settle.mutate('take-theirs')}>
          Take theirs
        </Button>
        {canKeepBoth && (
          <Button disabled={settle.isPending} onClick={() => settle.mutate('keep-both')}>
            Keep both
          </Button>
        )}
      </div>
      {settle.error && <p role="alert" className="mt-2 text-sm text-odds">{settle.error.message}</p>}
    </li>
  );
}

function Side({ title, s, testId }: { title: string; s: DocSummary | null; testId: string }) {
  return (
    <div data-testid={testId} className="rounded border border-rule p-3 text-sm">
      <h3 className="mb-2 text-xs font-semibold uppercase tracking-wide text-ink-soft">{title}</h3>
      {!s ? (
        <p className="text-ink-soft">Nothing on the server.</p>
      ) : s.deleted ? (
        <p data-testid={`${testId}-deleted`}>
          Deleted{s.who ? ` by ${s.who}` : ''}
          {s.when ? `, ${new Date(s.when).toLocaleString()}` : ''}. <span className="text-ink-soft">{s.name}</span>
        </p>
      ) : (
        <dl className="grid grid-cols-[6rem_1fr] gap-y-0.5">
          <dt className="text-ink-faint">name</dt>
          <dd data-testid={`${testId}-name`}>{s.name}</dd>
          <dt className="text-ink-faint">version</dt>
          <dd className="num">{s.version ?? 'none yet (made here)'}</dd>
          <dt className="text-ink-faint">size</dt>
          <dd className="num">{s.bytes === null ? '—' : `${s.bytes.toLocaleString()} bytes`}</dd>
          <dt className="text-ink-faint">cells</dt>
          <dd className="num" data-testid={`${testId}-cells`}>{s.cells ? s.cells.join(' · ') : '—'}</dd>
          <dt className="text-ink-faint">who</dt>
          <dd>{s.who ?? '—'}</dd>
          <dt className="text-ink-faint">when</dt>
          <dd>{s.when ? new Date(s.when).toLocaleString() : '—'}</dd>
        </dl>
      )}
    </div>
  );
}
