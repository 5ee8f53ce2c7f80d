/**
 * Record local changes to linked projects in the outbox. The store stays
 * unaware of sync: callers (the compute service, the Desk) call these after
 * a successful save. Unlinked projects record nothing, so local work stays local.
 */
import type { DocKind } from '../../shared/sync/types';
import type { GluefieldDb, ModelRow, ProjectRow, RunRow } from '../store';

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

/** A model was created or got a new version. */
export const recordModelSaved = (db: GluefieldDb, model: Pick<ModelRow, 'id' | 'projectId'>) => recordChange(db, model.projectId, model.id, 'model');

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
