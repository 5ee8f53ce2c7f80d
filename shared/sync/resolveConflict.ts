import type { ChangeInput, ConflictedChange, Resolution, SyncedDoc } from './types';

/** Fresh ids the caller generates (keeps this function pure). */
export interface FreshIds {
  changeId: string;
  /** Used only by keep-both: the id of the copy that keeps the client's content. */
  docId: string;
}

export interface ResolutionPlan {
  /** Changes to queue in the outbox. */
  push: ChangeInput[];
  /** The server copy the client should now hold under the conflicted id (null: none). */
  adopt: SyncedDoc | null;
}

/**
 * Turn the user's choice on a conflict into outbox changes, so that nothing
 * is silently overwritten:
 * - keep-mine re-sends the client's content on top of the server's version;
 * - take-theirs sends nothing and adopts the server copy;
 * - keep-both adopts the server copy and sends the client's content as a new document.
 * A document whose kind differs on the server cannot be overwritten in
 * place, so keep-mine then behaves as keep-both.
 */
export function resolveConflict(mine: ChangeInput, conflict: ConflictedChange, choice: Resolution, ids: FreshIds): ResolutionPlan {
  const server = conflict.server;
  const content = { body: mine.body, uploadId: mine.uploadId, deleted: mine.deleted };
  const strip = (c: ChangeInput): ChangeInput =>
    Object.fromEntries(Object.entries(c).filter(([, v]) => v !== undefined)) as unknown as ChangeInput;
  if (choice === 'take-theirs') return { push: [], adopt: server };
  if (choice === 'keep-mine' && conflict.reason !== 'kind-mismatch') {
    const baseVersion = server?.version ?? 0;
    return { push: [strip({ changeId: ids.changeId, docId: mine.docId, kind: mine.kind, baseVersion, ...content })], adopt: null };
  }
  if (mine.deleted) return { push: [], adopt: server };
  return {
    push: [strip({ changeId: ids.changeId, docId: ids.docId, kind: mine.kind, baseVersion: 0, ...content })],
    adopt: server,
  };
}
