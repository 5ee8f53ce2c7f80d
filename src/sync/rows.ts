import type { ChangeInput, ConflictReason, DocKind, SyncedDoc } from '../../shared/sync/types';

/**
 * One local change to a linked project, waiting to be pushed. It names the
 * document only: the body is read from the local store when the push is
 * built, so several edits of one document between syncs travel as one.
 */
export interface OutboxRow {
  seq?: number;
  /** Local project id. */
  projectId: string;
  docId: string;
  kind: DocKind;
  /** Client-generated; kept across retries so a replay is harmless. */
  changeId: string;
  /** When set (a resolution chose it), the push uses this base instead of the known version. */
  baseVersion?: number;
  createdAt: number;
  /** Set once a push carried it; a later edit then queues a new change rather than reusing this id. */
  sentAt?: number;
  /** A deletion (pushed as a tombstone). The local row is gone, so its name travels here for the conflict screen. */
  deleted?: true;
  name?: string;
}

/** What the client knows of a document's server copy. */
export interface KnownDoc {
  kind: DocKind;
  version: number;
}

/** A push the server refused, kept until the user settles it. Nothing is overwritten meanwhile. */
export interface StoredConflict {
  changeId: string;
  docId: string;
  kind: DocKind;
  reason: ConflictReason;
  /** What was pushed (body with the local content). */
  mine: ChangeInput;
  /** A summary of the local copy for the side-by-side view. */
  mineSummary: DocSummary;
  server: SyncedDoc | null;
  at: number;
}

/** What the conflict screen shows of one side. */
export interface DocSummary {
  name: string;
  version: number | null;
  bytes: number | null;
  cells: number[] | null;
  who: string | null;
  when: string | null;
  /** This side deleted the document. */
  deleted?: boolean;
}

/** A project linked to the team server (the row exists only for linked projects). */
export interface SyncLinkRow {
  /** Local project id. */
  projectId: string;
  /** The team server's project id. */
  remoteId: string;
  /** Your role in the project on the server. */
  role: string;
  /** Pulled up to this project revision. */
  revision: number;
  /** The server's revision when last seen (to tell Behind). */
  serverRevision: number;
  docs: Record<string, KnownDoc>;
  conflicts: StoredConflict[];
  lastSyncAt: number | null;
  lastError: string | null;
}
