import { stamp } from './clock';
import type { GluefieldDb, RunRow } from './db';
import { StoreError } from './StoreError';
import { writeTx } from './transact';
import { checkField, checkId } from './validate';

export type NewRun = Omit<RunRow, 'id' | 'createdAt'>;

const STATUSES: readonly RunRow['status'][] = ['done', 'failed', 'cancelled'];

/**
 * Keep a run of a model. Throws StoreError `invalid` on malformed input and
 * `not-found` when the model is gone (say, deleted while the run was going).
 */
export async function saveRun(db: GluefieldDb, run: NewRun): Promise<RunRow> {
  checkRun(run);
  return writeTx(db, [db.models, db.runs], async () => {
    const model = await db.models.get(run.modelId);
    if (!model) throw new StoreError('not-found', `no model ${run.modelId}`);
    if (model.projectId !== run.projectId) throw new StoreError('invalid', `model ${run.modelId} is not in project ${run.projectId}`);
    const row: RunRow = { ...run, id: crypto.randomUUID(), createdAt: stamp() };
    await db.runs.add(row);
    return row;
  });
}

/** A model's runs, newest first. */
export async function listRuns(db: GluefieldDb, modelId: string): Promise<RunRow[]> {
  const rows = await db.runs.where('modelId').equals(modelId).toArray();
  return rows.sort((a, b) => b.createdAt - a.createdAt);
}

export async function getRun(db: GluefieldDb, id: string): Promise<RunRow | undefined> {
  return db.runs.get(id);
}

/** Unknown ids are a no-op. */
export async function deleteRun(db: GluefieldDb, id: string): Promise<void> {
  checkId(id, 'run');
  await writeTx(db, [db.runs], () => db.runs.delete(id));
}

function checkRun(run: NewRun): void {
  const invalid = (message: string): never => {
    throw new StoreError('invalid', message);
  };
  if (typeof run !== 'object' || run === null) invalid('a run must be an object');
  checkId(run.modelId, 'model');
  checkId(run.projectId, 'project');
  if (!Number.isSafeInteger(run.modelVersion) || run.modelVersion < 1) invalid('modelVersion must be a positive integer');
  if (typeof run.modelHash !== 'string') invalid('modelHash must be a string');
  if (typeof run.engineVersion !== 'string') invalid('engineVersion must be a string');
  if (!STATUSES.includes(run.status)) invalid(`status must be one of ${STATUSES.join(', ')}`);
  const s = run.settings;
  if (typeof s !== 'object' || s === null) invalid('settings must be {method, field, splitBlocks}');
  if (s.method !== 'morse' && s.method !== 'direct') invalid('settings.method must be morse or direct');
  checkField(s.field);
  if (typeof s.splitBlocks !== 'boolean') invalid('settings.splitBlocks must be a boolean');
  if (typeof run.ms !== 'number' || !(run.ms >= 0)) invalid('ms must be a non-negative number');
  if (run.status === 'done' && !run.report) invalid('a finished run needs its report');
}
