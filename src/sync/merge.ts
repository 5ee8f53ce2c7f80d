/**
 * The client side of the merge, pure and deterministic (no storage, no
 * network): what to do with a pulled document, how a push's answer updates
 * what the client knows, and a project's sync state. Tested by a table in
 * tests/sync-client/merge.test.ts.
 */
import type { PushResponse, SyncedDoc } from '../../shared/sync/types';
import type { DocSummary, KnownDoc, OutboxRow, StoredConflict, SyncLinkRow } from './rows';

export type SyncState = 'local' | 'in-step' | 'ahead' | 'behind' | 'at-odds';

export const SYNC_STATE_LABEL: Record<SyncState, string> = {
  local: 'Local only',
  'in-step': 'In step',
  ahead: 'Ahead',
  behind: 'Behind',
  'at-odds': 'At odds',
};

/** At odds (unsettled conflicts) beats Ahead (changes to push) beats Behind (the server moved on). */
export function syncStateOf(link: Pick<SyncLinkRow, 'revision' | 'serverRevision' | 'conflicts'> | undefined, pending: number): SyncState {
  if (!link) return 'local';
  if (link.conflicts.length > 0) return 'at-odds';
  if (pending > 0) return 'ahead';
  if (link.serverRevision > link.revision) return 'behind';
  return 'in-step';
}

export type PulledAction =
  /** Already held (an echo of our own push, or older). */
  | { type: 'skip' }
  /** Write the server copy locally. */
  | { type: 'adopt' }
  /** Remove the local copy (the server deleted it). */
  | { type: 'remove' }
  /** A local change is waiting or in conflict: keep the local copy; the push (or the user) settles it. */
  | { type: 'hold' };

export function decidePulled(known: KnownDoc | undefined, pending: boolean, conflicted: boolean, doc: SyncedDoc): PulledAction {
  if (known && known.version >= doc.version) return { type: 'skip' };
  if (pending || conflicted) return { type: 'hold' };
  return doc.deleted ? { type: 'remove' } : { type: 'adopt' };
}

export interface PushOutcome {
  docs: Record<string, KnownDoc>;
  conflicts: StoredConflict[];
  /** Outbox rows settled by this answer (accepted or now held as conflicts). */
  done: number[];
}

/**
 * Fold a push's answer into what the client knows: accepted changes move
 * the known version on; conflicts are kept (replacing an older conflict on
 * the same document) with both sides, for the user to settle.
 */
export function foldPush(
  link: Pick<SyncLinkRow, 'docs' | 'conflicts'>,
  sent: { row: OutboxRow; change: StoredConflict['mine']; summary: DocSummary }[],
  answer: PushResponse,
  now: number,
): PushOutcome {
  const docs = { ...link.docs };
  let conflicts = [...link.conflicts];
  const done: number[] = [];
  const byChange = new Map(sent.map((s) => [s.change.changeId, s]));
  for (const a of answer.accepted) {
    const s = byChange.get(a.changeId);
    if (!s) continue;
    docs[a.docId] = { kind: s.row.kind, version: a.version };
    conflicts = conflicts.filter((c) => c.docId !== a.docId);
    if (s.row.seq !== undefined) done.push(s.row.seq);
  }
  for (const c of answer.conflicts) {
    const s = byChange.get(c.changeId);
    if (!s) continue;
    conflicts = conflicts.filter((x) => x.docId !== c.docId);
    conflicts.push({ changeId: c.changeId, docId: c.docId, kind: s.row.kind, reason: c.reason, mine: s.change, mineSummary: s.summary, server: c.server, at: now });
    if (s.row.seq !== undefined) done.push(s.row.seq);
  }
  return { docs, conflicts, done };
}

/** The base a push uses for a document: the resolution's choice, else the known server version, else 0 (a create). */
export function baseVersionFor(row: Pick<OutboxRow, 'baseVersion' | 'docId'>, docs: Record<string, KnownDoc>): number {
  return row.baseVersion ?? docs[row.docId]?.version ?? 0;
}

/** Texts above this many bytes (UTF-8) travel as gzip uploads, not inline JSON. */
export const INLINE_TEXT_LIMIT = 16 * 1024;
