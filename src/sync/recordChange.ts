/**
 * Record local changes to linked projects in the outbox. The store stays
 * unaware of sync: callers (the compute service, the Desk) call these after
 * a successful save. Unlinked projects record nothing, so local work stays local.
 */
import type { DocKind } from '../../shared/sync/types';
import type { GluefieldDb, ModelRow, ProjectRow, ReadingsRow, RunRow } from '../store';

/** Queue `docId` of `projectId` for the next push. Several edits before a push become one change. */
export async function recordChange(db: GluefieldDb, projectId: string, docId: string, kind: DocKind, baseVersion?: number): Promise<boolean> {
  return db.transaction('rw', [db.syncLinks, db.outbox], async () => {
    const link = await db.syncLinks.get(projectId);
    if (!link) return false;
    const waiting = await db.outbox.where('[projectId+docId]').equals([projectId, docId]).toArray();
    // An entry not yet sent already stands for this edit (its body is read at push time).
    if (baseVersion === undefined && waiting.some((w) => w.sentAt === undefined)) return true;
    await db.outbox.add({ projectId, docId, kind, changeId: crypto.randomUUID(), createdAt: Date.now(), ...(baseVersion === undefined ? {} : { baseVersion }) });
    return true;
  });
}

/**
 * Queue a deletion of `docId`. A change still waiting for this document
 * becomes the deletion (nothing of its content is left to send); one the
 * server may already have taken stays, and the tombstone follows it.
 */
export async function recordDeletion(db: GluefieldDb, projectId: string, docId: string, kind: DocKind, name: string): Promise<boolean> {
  return db.transaction('rw', [db.syncLinks, db.outbox], async () => {
    const link = await db.syncLinks.get(projectId);
    if (!link) return false;
    const waiting = await db.outbox.where('[projectId+docId]').equals([projectId, docId]).toArray();
    const unsent = waiting.find((w) => w.sentAt === undefined && w.baseVersion === undefined);
    if (unsent) await db.outbox.put({ ...unsent, deleted: true, name });
    else await db.outbox.add({ projectId, docId, kind, changeId: crypto.randomUUID(), createdAt: Date.now(), deleted: true, name });
    return true;
  });
}

/** A model was created, got a new version or a new name (the name travels in the model's body). */
export const recordModelSaved = (db: GluefieldDb, model: Pick<ModelRow, 'id' | 'projectId'>) => recordChange(db, model.projectId, model.id, 'model');

/**
 * A model was deleted. Only the model gets a tombstone: its runs and
 * readings stay on the server, so if someone else's edit wins the conflict
 * (take theirs) the model comes back with them. Clients drop the runs and
 * readings of a model they no longer hold.
 */
export const recordModelDeleted = (db: GluefieldDb, model: Pick<ModelRow, 'id' | 'projectId' | 'name'>) => recordDeletion(db, model.projectId, model.id, 'model', model.name);

/** A readings file was saved (new, or a new text or name). */
export const recordReadingsSaved = (db: GluefieldDb, r: Pick<ReadingsRow, 'id' | 'projectId'>) => recordChange(db, r.projectId, r.id, 'readings');

export const recordReadingsDeleted = (db: GluefieldDb, r: Pick<ReadingsRow, 'id' | 'projectId' | 'name'>) => recordDeletion(db, r.projectId, r.id, 'readings', r.name);

/** A run was saved. */
export const recordRunSaved = (db: GluefieldDb, run: Pick<RunRow, 'id' | 'projectId'>) => recordChange(db, run.projectId, run.id, 'run');

/** The project was renamed (the project's own document is `project`). */
export const recordProjectRenamed = (db: GluefieldDb, project: Pick<ProjectRow, 'id'>) => recordChange(db, project.id, PROJECT_DOC_ID, 'project');

/** The document id of a project's own record (its name). */
export const PROJECT_DOC_ID = 'project';

/** How many changes wait to be pushed for a project. */
export async function pendingCount(db: GluefieldDb, projectId: string): Promise<number> {
  return db.outbox.where('projectId').equals(projectId).count();
}
