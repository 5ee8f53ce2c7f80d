import { randomUUID } from 'node:crypto';
import { Between, In } from 'typeorm';
import { decideChange } from '../../shared/sync/decideChange';
import type { AcceptedChange, ChangeInput, ConflictedChange, PullResponse, PushResponse } from '../../shared/sync/types';
import type { ChangeRow, DocumentRow, UserRow } from '../db/entities';
import { insertRow } from '../db/insertRow';
import type { Repos } from '../db/Repos';
import type { Transactor } from '../db/Transactor';
import { badRequest } from '../http/HttpError';
import { iso, type Clock } from './clock';
import { contentHash } from './contentHash';
import { recordAudit, type AuditAction } from './recordAudit';
import { docView } from './views';

type Outcome = { accepted: AcceptedChange } | { conflict: ConflictedChange };

/**
 * Push and pull of a project's documents. Each pushed change is decided by
 * `decideChange` (shared/sync) and applied in its own transaction together
 * with its change record, its audit entry and the project revision bump,
 * so a crash leaves either all of it or none. A changeId already recorded
 * answers its recorded outcome and applies nothing.
 */
export class SyncService {
  constructor(private readonly tx: Transactor, private readonly clock: Clock) {}

  async push(user: UserRow, projectId: string, changes: ChangeInput[]): Promise<PushResponse> {
    await this.checkUploads(projectId, changes);
    const accepted: AcceptedChange[] = [];
    const conflicts: ConflictedChange[] = [];
    for (const change of changes) {
      const outcome = await this.tx.write((repos) => this.applyOne(repos, user, projectId, change));
      if ('accepted' in outcome) accepted.push(outcome.accepted);
      else conflicts.push(outcome.conflict);
    }
    const revision = await this.tx.read(async (repos) => (await repos.projects.findOneByOrFail({ id: projectId })).revision);
    return { revision, accepted, conflicts };
  }

  /**
   * Documents changed after `since`, oldest change first, at most `limit`.
   * Each accepted change gives its document a revision of its own, so a
   * page ends cleanly at the last document's revision.
   */
  pull(projectId: string, since: number, limit: number): Promise<PullResponse> {
    return this.tx.read(async (repos) => {
      const project = await repos.projects.findOneByOrFail({ id: projectId });
      // A client ahead of the server (say, after a restore from backup) starts over.
      const from = since > project.revision ? 0 : since;
      const docs = await repos.documents.find({
        where: { projectId, revision: Between(from + 1, project.revision) },
        order: { revision: 'ASC' },
        take: limit + 1,
      });
      const more = docs.length > limit;
      const page = more ? docs.slice(0, limit) : docs;
      return { revision: more ? page[page.length - 1].revision : project.revision, changes: page.map(docView), more };
    });
  }

  private async applyOne(repos: Repos, user: UserRow, projectId: string, change: ChangeInput): Promise<Outcome> {
    // Taking the project row first serialises pushes to one project across server instances (a row lock on PostgreSQL).
    await repos.projects.update({ id: projectId }, { revision: () => 'revision' });
    const prior = await repos.changes.findOneBy({ projectId, changeId: change.changeId });
    if (prior) return this.replay(repos, prior);
    const doc = await repos.documents.findOneBy({ projectId, docId: change.docId });
    const hash = contentHash(change);
    const decision = decideChange(doc, change, doc?.contentHash === hash);
    const now = iso(this.clock());
    const record: ChangeRow = {
      id: randomUUID(), projectId, changeId: change.changeId, docId: change.docId, kind: change.kind, baseVersion: change.baseVersion,
      outcome: 'accepted', reason: null, version: null, revision: null, userId: user.id, createdAt: now,
    };
    if (decision.type === 'conflict') {
      await insertRow(repos.changes, { ...record, outcome: 'conflict', reason: decision.reason });
      await recordAudit(repos, now, { projectId, actorId: user.id, action: 'change.conflict', target: change.docId, detail: { kind: change.kind, reason: decision.reason, baseVersion: change.baseVersion, serverVersion: doc?.version ?? null } });
      return { conflict: { changeId: change.changeId, docId: change.docId, reason: decision.reason, server: doc ? docView(doc) : null } };
    }
    if (decision.type === 'same') {
      await insertRow(repos.changes, { ...record, version: doc!.version, revision: doc!.revision });
      return { accepted: { changeId: change.changeId, docId: change.docId, version: doc!.version, revision: doc!.revision } };
    }
    await repos.projects.update({ id: projectId }, { revision: () => 'revision + 1', updatedAt: now });
    const { revision } = await repos.projects.findOneByOrFail({ id: projectId });
    const content = change.deleted
      ? { body: null, uploadId: null, deleted: true }
      : { body: change.body === undefined ? null : JSON.stringify(change.body), uploadId: change.uploadId ?? null, deleted: false };
    const next: DocumentRow = {
      id: doc?.id ?? randomUUID(), projectId, docId: change.docId, kind: change.kind, version: decision.version, revision, ...content,
      contentHash: hash, createdBy: doc?.createdBy ?? user.id, updatedBy: user.id, createdAt: doc?.createdAt ?? now, updatedAt: now,
    };
    if (doc) await repos.documents.update({ id: doc.id }, next);
    else await insertRow(repos.documents, next);
    await insertRow(repos.changes, { ...record, version: decision.version, revision });
    await recordAudit(repos, now, { projectId, actorId: user.id, action: auditAction(change, doc), target: change.docId, detail: { kind: change.kind, version: decision.version } });
    return { accepted: { changeId: change.changeId, docId: change.docId, version: decision.version, revision } };
  }

  private async replay(repos: Repos, prior: ChangeRow): Promise<Outcome> {
    if (prior.outcome === 'accepted') {
      return { accepted: { changeId: prior.changeId, docId: prior.docId, version: prior.version!, revision: prior.revision! } };
    }
    const doc = await repos.documents.findOneBy({ projectId: prior.projectId, docId: prior.docId });
    return { conflict: { changeId: prior.changeId, docId: prior.docId, reason: prior.reason!, server: doc ? docView(doc) : null } };
  }

  /** Every upload a push names must exist in the project, checked before anything is applied. */
  private async checkUploads(projectId: string, changes: ChangeInput[]): Promise<void> {
    const ids = [...new Set(changes.flatMap((c) => (c.uploadId && !c.deleted ? [c.uploadId] : [])))];
    if (!ids.length) return;
    const found = await this.tx.read((repos) => repos.uploads.find({ select: { id: true }, where: { projectId, id: In(ids) } }));
    const missing = ids.filter((id) => !found.some((u) => u.id === id));
    if (missing.length) throw badRequest(`no upload ${missing[0]} in this project`);
  }
}

function auditAction(change: ChangeInput, before: DocumentRow | null): AuditAction {
  if (change.deleted) return 'document.delete';
  if (change.kind === 'run' && !before) return 'run.record';
  return before && !before.deleted ? 'document.update' : 'document.create';
}
