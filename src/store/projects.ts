import { stamp } from './clock';
import type { GluefieldDb, ProjectRow } from './db';
import { StoreError } from './StoreError';
import { writeTx } from './transact';
import { checkId, checkName } from './validate';

/** Every project, most recently changed first. */
export async function listProjects(db: GluefieldDb): Promise<ProjectRow[]> {
  return db.projects.orderBy('updatedAt').reverse().toArray();
}

export async function getProject(db: GluefieldDb, id: string): Promise<ProjectRow | undefined> {
  return db.projects.get(id);
}

/** A new, empty project. Throws StoreError `invalid` on an empty name. */
export async function createProject(db: GluefieldDb, name: string): Promise<ProjectRow> {
  const now = stamp();
  const row: ProjectRow = { id: crypto.randomUUID(), name: checkName(name, 'project'), createdAt: now, updatedAt: now };
  await writeTx(db, [db.projects], () => db.projects.add(row));
  return row;
}

/** Throws StoreError `invalid` on an empty name, `not-found` for an unknown project. */
export async function renameProject(db: GluefieldDb, id: string, name: string): Promise<ProjectRow> {
  checkId(id, 'project');
  const clean = checkName(name, 'project');
  return writeTx(db, [db.projects], async () => {
    const row = await db.projects.get(id);
    if (!row) throw new StoreError('not-found', `no project ${id}`);
    const next = { ...row, name: clean, updatedAt: stamp() };
    await db.projects.put(next);
    return next;
  });
}

/** Delete a project with its models, their texts and their runs, and its saved kit results, all or nothing. Unknown ids are a no-op. */
export async function deleteProject(db: GluefieldDb, id: string): Promise<void> {
  checkId(id, 'project');
  await writeTx(db, [db.projects, db.models, db.modelTexts, db.runs, db.readings, db.kitResults], async () => {
    await db.kitResults.where('projectId').equals(id).delete();
    const modelIds = await db.models.where('projectId').equals(id).primaryKeys();
    await db.modelTexts.where('modelId').anyOf(modelIds).delete();
    await db.readings.where('projectId').equals(id).delete();
    await db.runs.where('modelId').anyOf(modelIds).delete();
    await db.runs.where('projectId').equals(id).delete();
    await db.models.bulkDelete(modelIds);
    await db.projects.delete(id);
  });
}

/**
 * Mark a project changed; call inside a write transaction that includes
 * `projects`. Throws StoreError `not-found` (aborting that transaction).
 */
export async function touchProject(db: GluefieldDb, id: string, at: number): Promise<void> {
  const row = await db.projects.get(id);
  if (!row) throw new StoreError('not-found', `no project ${id}`);
  await db.projects.put({ ...row, updatedAt: at });
}
