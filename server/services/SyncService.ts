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
import { recordAudits, type AuditAction, type AuditInput } from './recordAudit';
import { KeyedBatcher } from './KeyedBatcher';
import { docView } from './views';

type Outcome = { accepted: AcceptedChange } | { conflict: ConflictedChange };

/** What a change will write, worked out before the transaction so none of it is done while the project is locked. */
interface Prepared {
  change: ChangeInput;
  hash: string;
  content: Pick<DocumentRow, 'body' | 'uploadId' | 'deleted'>;
}

interface Push {
  user: UserRow;
  prepared: Prepared[];
}

/** Changes in one transaction at most, whatever waits: the batched inserts stay well inside both databases' limits on bind parameters. */
const MAX_CHANGES_PER_TRANSACTION = 1000;

/**
 * Push and pull of a project's documents. Pushes to one project take turns
 * in this instance (`KeyedBatcher`), and the pushes waiting for a turn go
 * together in one transaction, applied one after the other as if each had
 * its own. The transaction locks the project row, reads the heads of every
 * document and every changeId named in one query each, decides each change
 * in order with `decideChange` (shared/sync) against the heads as the
 * earlier changes left them, and writes the documents, change records,
 * audit entries and the project revision together, so a crash leaves all
 * of it or none. A changeId already recorded answers its recorded outcome
 * and applies nothing.
 */
export class SyncService {
  private readonly pushes = new KeyedBatcher<string, Push, PushResponse>(
    (projectId, pushes) => this.tx.write((repos) => this.apply(repos, projectId, pushes)),
    (push) => push.prepared.length,
    MAX_CHANGES_PER_TRANSACTION,
  );

  constructor(private readonly tx: Transactor, private readonly clock: Clock) {}

  async push(user: UserRow, projectId: string, changes: ChangeInput[]): Promise<PushResponse> {
    await this.checkUploads(projectId, changes);
    const prepared: Prepared[] = changes.map((change) => ({
      change,
      hash: contentHash(change),
      content: change.deleted
        ? { body: null, uploadId: null, deleted: true }
        : { body: change.body === undefined ? null : JSON.stringify(change.body), uploadId: change.uploadId ?? null, deleted: false },
    }));
    return this.pushes.run(projectId, { user, prepared });
  }

  /**
   * Documents changed after `since`, oldest change first, at most `limit`.
   * Each accepted change gives its document a revision of its own, so a
   * page ends cleanly at the last document's revision. Takes no lock: a
   * push commits its documents and the project revision together, so every
   * document at or below the revision read first is already visible.
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

  private async apply(repos: Repos, projectId: string, pushes: Push[]): Promise<PushResponse[]> {
    // The lock comes first, so pushes to one project are serialised across server instances (a row lock on
    // PostgreSQL) and every read below sees what the push before this one committed.
    await repos.projects.update({ id: projectId }, { revision: () => 'revision' });
    let { revision } = await repos.projects.findOneOrFail({ select: { revision: true }, where: { id: projectId } });
    const startRevision = revision;
    const all = pushes.flatMap((push) => push.prepared);
    const changeIds = [...new Set(all.map((p) => p.change.changeId))];
    const docIds = [...new Set(all.map((p) => p.change.docId))];
    const priors = new Map((await repos.changes.findBy({ projectId, changeId: In(changeIds) })).map((c) => [c.changeId, c]));
    const heads = new Map((await repos.documents.findBy({ projectId, docId: In(docIds) })).map((d) => [d.docId, d]));

    const now = iso(this.clock());
    const written = new Map<string, DocumentRow>();
    const records: ChangeRow[] = [];
    const audits: AuditInput[] = [];
    const outcomes = new Map<string, Outcome>();
    const answers: PushResponse[] = [];

    for (const { user, prepared } of pushes) {
      const accepted: AcceptedChange[] = [];
      const conflicts: ConflictedChange[] = [];
      const answer = (outcome: Outcome) => {
        if ('accepted' in outcome) accepted.push(outcome.accepted);
        else conflicts.push(outcome.conflict);
      };
      for (const { change, hash, content } of prepared) {
        // A changeId recorded before, or earlier in this transaction, answers as it did then.
        const prior = priors.get(change.changeId);
        if (prior) {
          answer(replay(prior, heads.get(prior.docId) ?? null));
          continue;
        }
        const earlier = outcomes.get(change.changeId);
        if (earlier) {
          const head = 'conflict' in earlier ? heads.get(earlier.conflict.docId) : undefined;
          answer('accepted' in earlier ? earlier : { conflict: { ...earlier.conflict, server: head ? docView(head) : null } });
          continue;
        }
        const doc = heads.get(change.docId) ?? null;
        const decision = decideChange(doc, change, doc?.contentHash === hash);
        const record: ChangeRow = {
          id: randomUUID(), projectId, changeId: change.changeId, docId: change.docId, kind: change.kind, baseVersion: change.baseVersion,
          outcome: 'accepted', reason: null, version: null, revision: null, userId: user.id, createdAt: now,
        };
        let outcome: Outcome;
        if (decision.type === 'conflict') {
          records.push({ ...record, outcome: 'conflict', reason: decision.reason });
          audits.push({ projectId, actorId: user.id, action: 'change.conflict', target: change.docId, detail: { kind: change.kind, reason: decision.reason, baseVersion: change.baseVersion, serverVersion: doc?.version ?? null } });
          outcome = { conflict: { changeId: change.changeId, docId: change.docId, reason: decision.reason, server: doc ? docView(doc) : null } };
        } else if (decision.type === 'same') {
          records.push({ ...record, version: doc!.version, revision: doc!.revision });
          outcome = { accepted: { changeId: change.changeId, docId: change.docId, version: doc!.version, revision: doc!.revision } };
        } else {
          revision += 1;
          const next: DocumentRow = {
            id: doc?.id ?? randomUUID(), projectId, docId: change.docId, kind: change.kind, version: decision.version, revision, ...content,
            contentHash: hash, createdBy: doc?.createdBy ?? user.id, updatedBy: user.id, createdAt: doc?.createdAt ?? now, updatedAt: now,
          };
          heads.set(change.docId, next);
          written.set(change.docId, next);
          records.push({ ...record, version: decision.version, revision });
          audits.push({ projectId, actorId: user.id, action: auditAction(change, doc), target: change.docId, detail: { kind: change.kind, version: decision.version } });
          outcome = { accepted: { changeId: change.changeId, docId: change.docId, version: decision.version, revision } };
        }
        outcomes.set(change.changeId, outcome);
        answer(outcome);
      }
      answers.push({ revision, accepted, conflicts });
    }

    // One statement per table, however many changes: each round trip is time the project stays locked.
    if (written.size) {
      await repos.documents
        .createQueryBuilder()
        .insert()
        .values([...written.values()])
        .orUpdate(['kind', 'version', 'revision', 'body', 'uploadId', 'deleted', 'contentHash', 'updatedBy', 'updatedAt'], ['projectId', 'docId'])
        .updateEntity(false)
        .execute();
    }
    if (records.length) await insertRow(repos.changes, records);
    if (audits.length) await recordAudits(repos, now, audits);
    if (revision !== startRevision) await repos.projects.update({ id: projectId }, { revision, updatedAt: now });
    return answers;
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

function replay(prior: ChangeRow, doc: DocumentRow | null): Outcome {
  if (prior.outcome === 'accepted') {
    return { accepted: { changeId: prior.changeId, docId: prior.docId, version: prior.version!, revision: prior.revision! } };
  }
  return { conflict: { changeId: prior.changeId, docId: prior.docId, reason: prior.reason!, server: doc ? docView(doc) : null } };
}

function auditAction(change: ChangeInput, before: DocumentRow | null): AuditAction {
  if (change.deleted) return 'document.delete';
  if (change.kind === 'run' && !before) return 'run.record';
  return before && !before.deleted ? 'document.update' : 'document.create';
}
