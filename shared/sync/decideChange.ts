import type { ConflictReason, DocKind } from './types';

/** What the server knows of a document before a change. */
export interface DocHead {
  kind: DocKind;
  version: number;
  deleted: boolean;
}

/** What a change claims. */
export interface ChangeHead {
  kind: DocKind;
  baseVersion: number;
}

export type Decision =
  /** Write the change as this new version. */
  | { type: 'apply'; version: number }
  /** The client already has exactly the server's content: accept without a new version. */
  | { type: 'same'; version: number }
  | { type: 'conflict'; reason: ConflictReason };

/**
 * Decide one incoming change against the server's copy, by version alone
 * (optimistic concurrency): a change applies only on top of the version it
 * was made from. `sameContent` says whether the change's content equals the
 * server's current content; then a stale base is no disagreement (two
 * people made the same edit), so nothing is overwritten and nothing is
 * reported as a conflict. Pure and deterministic.
 */
export function decideChange(server: DocHead | null, change: ChangeHead, sameContent: boolean): Decision {
  if (server === null) {
    return change.baseVersion === 0 ? { type: 'apply', version: 1 } : { type: 'conflict', reason: 'unknown-base' };
  }
  if (server.kind !== change.kind) return { type: 'conflict', reason: 'kind-mismatch' };
  if (change.baseVersion === server.version) {
    return sameContent ? { type: 'same', version: server.version } : { type: 'apply', version: server.version + 1 };
  }
  if (sameContent) return { type: 'same', version: server.version };
  return { type: 'conflict', reason: change.baseVersion > server.version ? 'unknown-base' : 'stale' };
}
