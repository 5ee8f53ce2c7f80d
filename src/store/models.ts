import Dexie from 'dexie';
import { stamp } from './clock';
import { MAX_TEXT_VERSIONS, type GluefieldDb, type ModelRow, type ModelSource, type ModelTextRow } from './db';
import { prepareText, unpackText } from './pack';
import { touchProject } from './projects';
import { StoreError } from './StoreError';
import { writeTx } from './transact';
import { checkCounts, checkFieldLabel, checkId, checkName, checkSource, checkText } from './validate';

/** What the caller knows about a model text (the engine's summary of it). */
export interface ModelSummary {
  /** The engine's field label: "rational", "real" or "prime:P". */
  field: string;
  cells: number[];
  cochainDims: number[];
}

export interface NewModel extends ModelSummary {
  projectId: string;
  name: string;
  text: string;
  source: ModelSource;
}

export interface ModelVersionInput extends ModelSummary {
  text: string;
  /** Defaults to the model's current source. */
  source?: ModelSource;
}

/** One kept text version of a model. */
export interface ModelVersionInfo {
  /** The ModelTextRow id, `${modelId}@${version}`. */
  id: string;
  version: number;
  current: boolean;
}

export const textId = (modelId: string, version: number): string => `${modelId}@${version}`;

/** A project's models, most recently changed first. */
export async function listModels(db: GluefieldDb, projectId: string): Promise<ModelRow[]> {
  const rows = await db.models.where('projectId').equals(projectId).toArray();
  return rows.sort((a, b) => b.updatedAt - a.updatedAt);
}

export async function getModel(db: GluefieldDb, id: string): Promise<ModelRow | undefined> {
  return db.models.get(id);
}

/**
 * Store a new model (version 1) and its packed text in one transaction.
 * Throws StoreError `invalid` (bad input, checked before any write) or
 * `not-found` (unknown project); either way nothing is written.
 */
export async function saveNewModel(db: GluefieldDb, input: NewModel): Promise<ModelRow> {
  const prepared = await prepareNewModel(input);
  await writeTx(db, [db.projects, db.models, db.modelTexts], async () => {
    await touchProject(db, prepared.model.projectId, prepared.model.updatedAt);
    await db.models.add(prepared.model);
    await db.modelTexts.add(prepared.text);
  });
  return prepared.model;
}

/**
 * Validate, pack and hash a new model's rows without writing them: the
 * slow, non-database part of {@link saveNewModel}, shared with the demo seed.
 */
export async function prepareNewModel(input: NewModel): Promise<{ model: ModelRow; text: ModelTextRow }> {
  const projectId = checkId(input?.projectId, 'project');
  const name = checkName(input.name, 'model');
  const text = checkText(input.text);
  const source = checkSource(input.source);
  const field = checkFieldLabel(input.field);
  const counts = checkCounts(input.cells, input.cochainDims);
  const { packed, hash, bytes } = await prepareText(text);
  const now = stamp();
  const id = crypto.randomUUID();
  const model: ModelRow = { id, projectId, name, version: 1, hash, field, ...counts, bytes, source, createdAt: now, updatedAt: now };
  return { model, text: { id: textId(id, 1), modelId: id, version: 1, packed, bytes } };
}

/**
 * Store a new version of a model's text (version + 1) and update its
 * summary; keeps the newest {@link MAX_TEXT_VERSIONS} text versions. One
 * transaction: on any failure the previous version stays current and intact.
 */
export async function saveModelVersion(db: GluefieldDb, modelId: string, input: ModelVersionInput): Promise<ModelRow> {
  checkId(modelId, 'model');
  const text = checkText(input?.text);
  const source = input.source === undefined ? undefined : checkSource(input.source);
  const field = checkFieldLabel(input.field);
  const counts = checkCounts(input.cells, input.cochainDims);
  const { packed, hash, bytes } = await prepareText(text);
  return writeTx(db, [db.projects, db.models, db.modelTexts], async () => {
    const old = await db.models.get(modelId);
    if (!old) throw new StoreError('not-found', `no model ${modelId}`);
    const version = old.version + 1;
    const next: ModelRow = { ...old, version, hash, field, ...counts, bytes, source: source ?? old.source, updatedAt: stamp() };
    await db.modelTexts.add({ id: textId(modelId, version), modelId, version, packed, bytes });
    await db.models.put(next);
    await db.modelTexts
      .where('[modelId+version]')
      .between([modelId, Dexie.minKey], [modelId, version - MAX_TEXT_VERSIONS], true, true)
      .delete();
    await touchProject(db, old.projectId, next.updatedAt);
    return next;
  });
}

/** The text of one version (default: the current one). Throws StoreError `not-found` or `corrupt`. */
export async function loadModelText(db: GluefieldDb, modelId: string, version?: number): Promise<string> {
  let v = version;
  if (v === undefined) {
    const model = await db.models.get(modelId);
    if (!model) throw new StoreError('not-found', `no model ${modelId}`);
    v = model.version;
  }
  const row = await db.modelTexts.get(textId(modelId, v));
  if (!row) throw new StoreError('not-found', `model ${modelId} has no stored version ${v}`);
  return unpackText(row.packed);
}

/** The kept text versions of a model, newest first; reads keys only, not the texts. */
export async function listModelVersions(db: GluefieldDb, modelId: string): Promise<ModelVersionInfo[]> {
  const [model, keys] = await Promise.all([
    db.models.get(modelId),
    db.modelTexts.where('[modelId+version]').between([modelId, Dexie.minKey], [modelId, Dexie.maxKey]).keys(),
  ]);
  return keys
    .map((k) => (k as unknown as [string, number])[1])
    .sort((a, b) => b - a)
    .map((version) => ({ id: textId(modelId, version), version, current: version === model?.version }));
}

/** Throws StoreError `invalid` on an empty name, `not-found` for an unknown model. */
export async function renameModel(db: GluefieldDb, id: string, name: string): Promise<ModelRow> {
  checkId(id, 'model');
  const clean = checkName(name, 'model');
  return writeTx(db, [db.projects, db.models], async () => {
    const row = await db.models.get(id);
    if (!row) throw new StoreError('not-found', `no model ${id}`);
    const next = { ...row, name: clean, updatedAt: stamp() };
    await db.models.put(next);
    await touchProject(db, row.projectId, next.updatedAt);
    return next;
  });
}

/** Delete a model with all its text versions and runs, all or nothing. Unknown ids are a no-op. */
export async function deleteModel(db: GluefieldDb, id: string): Promise<void> {
  checkId(id, 'model');
  await writeTx(db, [db.projects, db.models, db.modelTexts, db.runs, db.readings], async () => {
    const row = await db.models.get(id);
    if (!row) return;
    await db.modelTexts.where('modelId').equals(id).delete();
    await db.runs.where('modelId').equals(id).delete();
    await db.readings.where('modelId').equals(id).delete();
    await db.models.delete(id);
    const project = await db.projects.get(row.projectId);
    if (project) await db.projects.put({ ...project, updatedAt: stamp() });
  });
}
