/**
 * The sync wire format shared by the server and the browser client. Pure
 * types: nothing here touches Node, the DOM or storage.
 *
 * A project is a set of documents. Each document has a version (1 on its
 * first accepted change, +1 on every further one) and the project revision
 * at which it last changed. Every accepted change bumps the project
 * revision by one, so "everything since revision R" is the documents whose
 * revision is above R.
 */

/** What a synced document holds. Run results carry their provenance in the body. */
export const DOC_KINDS = ['project', 'model', 'readings', 'run', 'note'] as const;
export type DocKind = (typeof DOC_KINDS)[number];

/** Provenance every `run` document's body must carry (who ran it is the change's author on the server). */
export interface RunProvenance {
  engineVersion: string;
  method: string;
  field: string;
  modelHash: string;
  /** When the run finished on the client: ISO 8601 or epoch milliseconds. */
  ranAt: string | number;
}

/** One change from a client's outbox. */
export interface ChangeInput {
  /** Client-generated and unique within the project; replaying it is harmless. */
  changeId: string;
  docId: string;
  kind: DocKind;
  /** The server version the client edited; 0 for a document the client created. */
  baseVersion: number;
  /** The document's new content (any JSON); omitted when `uploadId` or `deleted` says it all. */
  body?: unknown;
  /** A compressed payload uploaded first through `POST /api/projects/:id/uploads`. */
  uploadId?: string;
  deleted?: boolean;
}

export interface PushRequest {
  changes: ChangeInput[];
}

/** The server's copy of a document. */
export interface SyncedDoc {
  docId: string;
  kind: DocKind;
  version: number;
  /** Project revision of the document's last accepted change. */
  revision: number;
  body: unknown;
  uploadId: string | null;
  deleted: boolean;
  createdBy: string;
  updatedBy: string;
  /** ISO 8601 */
  updatedAt: string;
}

/** Why a change was not applied. */
export type ConflictReason =
  /** The client's baseVersion is not the server's version: someone changed it first. */
  | 'stale'
  /** The client based its edit on a version the server has never had. */
  | 'unknown-base'
  /** The document exists with another kind. */
  | 'kind-mismatch';

export interface AcceptedChange {
  changeId: string;
  docId: string;
  /** The document's version after the change. */
  version: number;
  /** The project revision that recorded the change. */
  revision: number;
}

export interface ConflictedChange {
  changeId: string;
  docId: string;
  reason: ConflictReason;
  /** The server copy to show beside the client's; null when the server has none. */
  server: SyncedDoc | null;
}

export interface PushResponse {
  /** The project revision after the push. */
  revision: number;
  accepted: AcceptedChange[];
  conflicts: ConflictedChange[];
}

export interface PullResponse {
  /** Pull again with `since` set to this; when `more` is true, at once. */
  revision: number;
  /** Documents changed after `since`, in revision order. */
  changes: SyncedDoc[];
  more: boolean;
}

/** How the user settles a conflict. */
export type Resolution = 'keep-mine' | 'take-theirs' | 'keep-both';
