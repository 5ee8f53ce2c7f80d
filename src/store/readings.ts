import { stamp } from './clock';
import type { GluefieldDb, ReadingsRow } from './db';
import { packText, unpackText } from './pack';
import { StoreError } from './StoreError';
import { writeTx } from './transact';
import { checkId, checkName, checkText } from './validate';

export interface NewReadings {
  modelId: string;
  name: string;
  text: string;
  /** number of readings in the file (the caller has read it) */
  count: number;
}

/** Keep a readings file with its model; packed and validated before anything is written. */
export async function saveReadings(db: GluefieldDb, input: NewReadings): Promise<ReadingsRow> {
  checkId(input.modelId, 'model');
  checkName(input.name, 'readings');
  checkText(input.text);
  if (!Number.isInteger(input.count) || input.count < 0) throw new StoreError('invalid', 'the readings count must be a non-negative integer');
  const packed = await packText(input.text);
  return writeTx(db, [db.models, db.readings], async () => {
    const model = await db.models.get(input.modelId);
    if (!model) throw new StoreError('not-found', `model ${input.modelId} not found`);
    const now = stamp();
    const row: ReadingsRow = {
      id: crypto.randomUUID(),
      modelId: model.id,
      projectId: model.projectId,
      name: input.name.trim(),
      packed,
      bytes: input.text.length,
      count: input.count,
      createdAt: now,
      updatedAt: now,
    };
    await db.readings.add(row);
    return row;
  });
}

export interface ReadingsUpdate {
  name?: string;
  text?: string;
  count?: number;
}

/** Rename a readings file or replace its text (with its count); checked and packed before anything is written. */
export async function updateReadings(db: GluefieldDb, id: string, update: ReadingsUpdate): Promise<ReadingsRow> {
  checkId(id, 'readings');
  const name = update.name === undefined ? undefined : checkName(update.name, 'readings');
  if (update.text !== undefined) checkText(update.text);
  if ((update.text === undefined) !== (update.count === undefined)) throw new StoreError('invalid', 'a new readings text comes with its count');
  if (update.count !== undefined && (!Number.isInteger(update.count) || update.count < 0)) throw new StoreError('invalid', 'the readings count must be a non-negative integer');
  const packed = update.text === undefined ? undefined : await packText(update.text);
  return writeTx(db, [db.readings], async () => {
    const row = await db.readings.get(id);
    if (!row) throw new StoreError('not-found', `readings ${id} not found`);
    const next: ReadingsRow = {
      ...row,
      ...(name === undefined ? {} : { name }),
      ...(packed === undefined ? {} : { packed, bytes: update.text!.length, count: update.count! }),
      updatedAt: stamp(),
    };
    await db.readings.put(next);
    return next;
  });
}

/** A model's readings files, newest first. */
export async function listReadings(db: GluefieldDb, modelId: string): Promise<ReadingsRow[]> {
  const rows = await db.readings.where('modelId').equals(modelId).toArray();
  return rows.sort((a, b) => b.updatedAt - a.updatedAt);
}

export async function loadReadingsText(db: GluefieldDb, id: string): Promise<string> {
  const row = await db.readings.get(id);
  if (!row) throw new StoreError('not-found', `readings ${id} not found`);
  return unpackText(row.packed);
}

export async function deleteReadings(db: GluefieldDb, id: string): Promise<void> {
  await db.readings.delete(id);
}
