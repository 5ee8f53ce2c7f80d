import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import {
  createProject,
  deleteModel,
  getModel,
  hashText,
  listModels,
  listModelVersions,
  listRuns,
  loadModelText,
  MAX_TEXT_VERSIONS,
  renameModel,
  saveModelVersion,
  saveNewModel,
  saveRun,
  StoreError,
  type GluefieldDb,
  type ModelRow,
} from '../../src/store';
import { freshDb, newModel, ringText, summarize } from './helpers';

async function setUp(): Promise<{ db: GluefieldDb; projectId: string; model: ModelRow; text: string }> {
  const db = freshDb();
  const { id: projectId } = await createProject(db, 'Survey');
  const text = ringText(3);
  const model = await saveNewModel(db, newModel(projectId, text, 'Three-station ring'));
  return { db, projectId, model, text };
}

const versionOf = (n: number) => ({ text: ringText(n), ...summarize(ringText(n)) });

describe('models', () => {
  test('saveNewModel stores version 1 with its hash, counts and one packed text row', async () => {
    const { db, projectId, model, text } = await setUp();
    expect(model).toMatchObject({ projectId, name: 'Three-station ring', version: 1, field: 'rational', cells: [3, 3], cochainDims: [3, 3], source: 'model' });
    expect(model.hash).toBe(await hashText(text));
    expect(model.bytes).toBe(text.length);
    expect(await getModel(db, model.id)).toEqual(model);
    expect(await listModels(db, projectId)).toEqual([model]);
    expect(await loadModelText(db, model.id)).toBe(text);
    const rows = await db.modelTexts.where('modelId').equals(model.id).toArray();
    expect(rows.map((r) => [r.id, r.version, r.bytes])).toEqual([[`${model.id}@1`, 1, text.length]]);
    expect(rows[0].packed).toBeInstanceOf(Uint8Array);
  });

  test('saveNewModel into an unknown project is StoreError not-found and writes nothing', async () => {
    const db = freshDb();
    await expect(saveNewModel(db, newModel('no-such-project'))).rejects.toMatchObject({ code: 'not-found' });
    expect(await db.models.count()).toBe(0);
    expect(await db.modelTexts.count()).toBe(0);
  });

  test.each([
    ['an empty name', { name: '  ' }],
    ['an empty text', { text: '' }],
    ['an unknown source', { source: 'xls' }],
    ['a field that is not rational, real or prime:P', { field: 'complex' }],
    ['a composite modulus', { field: 'prime:91' }],
    ['negative cell counts', { cells: [-1, 3] }],
    ['counts of different lengths', { cochainDims: [3] }],
  ])('saveNewModel with %s is StoreError invalid and writes nothing', async (_, change) => {
    const { db, projectId } = await setUp();
    const before = await db.models.count();
    const err = await saveNewModel(db, { ...newModel(projectId), ...(change as object) }).catch((e) => e);
    expect(err).toBeInstanceOf(StoreError);
    expect(err.code).toBe('invalid');
    expect(await db.models.count()).toBe(before);
    expect(await db.modelTexts.count()).toBe(before);
  });

  test('saveModelVersion makes version 2 current and keeps version 1 loadable', async () => {
    const { db, model, text } = await setUp();
    const v2 = await saveModelVersion(db, model.id, { ...versionOf(5), source: 'editor' });
    expect(v2).toMatchObject({ id: model.id, version: 2, cells: [5, 5], source: 'editor', createdAt: model.createdAt });
    expect(v2.hash).toBe(await hashText(ringText(5)));
    expect(v2.updatedAt).toBeGreaterThan(model.updatedAt);
    expect(await loadModelText(db, model.id)).toBe(ringText(5));
    expect(await loadModelText(db, model.id, 1)).toBe(text);
    expect(await listModelVersions(db, model.id)).toEqual([
      { id: `${model.id}@2`, version: 2, current: true },
      { id: `${model.id}@1`, version: 1, current: false },
    ]);
    const v3 = await saveModelVersion(db, model.id, versionOf(6));
    expect(v3.source).toBe('editor');
  });

  test(`saveModelVersion keeps the newest ${MAX_TEXT_VERSIONS} text versions and drops older ones`, async () => {
    const { db, model } = await setUp();
    for (let n = 4; n < 4 + 24; n++) await saveModelVersion(db, model.id, versionOf(n));
    const current = await getModel(db, model.id);
    expect(current?.version).toBe(25);
    const versions = (await listModelVersions(db, model.id)).map((v) => v.version);
    expect(versions).toEqual(Array.from({ length: 20 }, (_, i) => 25 - i));
    expect(await db.modelTexts.where('modelId').equals(model.id).count()).toBe(MAX_TEXT_VERSIONS);
    expect(await loadModelText(db, model.id, 6)).toBe(ringText(8));
    await expect(loadModelText(db, model.id, 5)).rejects.toMatchObject({ code: 'not-found' });
    expect(await loadModelText(db, model.id)).toBe(ringText(27));
  });

  test('a refused saveModelVersion (invalid input) leaves the previous version current and intact', async () => {
    const { db, model, text } = await setUp();
    const bad = [
      { ...versionOf(4), text: '' },
      { ...versionOf(4), cells: [4.5, 4] },
      { ...versionOf(4), field: 'prime:1' },
      { ...versionOf(4), source: 'pdf' as never },
    ];
    for (const input of bad) {
      await expect(saveModelVersion(db, model.id, input)).rejects.toMatchObject({ code: 'invalid' });
    }
    await expect(saveModelVersion(db, 'no-such-model', versionOf(4))).rejects.toMatchObject({ code: 'not-found' });
    expect(await getModel(db, model.id)).toEqual(model);
    expect(await loadModelText(db, model.id)).toBe(text);
    expect(await db.modelTexts.count()).toBe(1);
  });

  test('a write that fails inside the transaction rolls back every write of that save', async () => {
    const { db, model, text } = await setUp();
    // The project row is written last; failing it must undo the text row and the model row written before it.
    const fail = () => {
      throw new Error('simulated write failure');
    };
    db.projects.hook('updating', fail);
    await expect(saveModelVersion(db, model.id, versionOf(4))).rejects.toThrow('simulated write failure');
    db.projects.hook('updating').unsubscribe(fail);
    expect(await getModel(db, model.id)).toEqual(model);
    expect(await loadModelText(db, model.id)).toBe(text);
    expect((await listModelVersions(db, model.id)).map((v) => v.version)).toEqual([1]);
  });

  test('renameModel changes the name only; an empty name is refused', async () => {
    const { db, model } = await setUp();
    const renamed = await renameModel(db, model.id, 'Ring, week 3');
    expect(renamed).toMatchObject({ name: 'Ring, week 3', version: 1, hash: model.hash });
    await expect(renameModel(db, model.id, '')).rejects.toMatchObject({ code: 'invalid' });
    await expect(renameModel(db, 'no-such-model', 'x')).rejects.toMatchObject({ code: 'not-found' });
    expect((await getModel(db, model.id))?.name).toBe('Ring, week 3');
  });

  test('listModels lists a project\'s models, most recently changed first', async () => {
    const { db, projectId, model } = await setUp();
    const other = await saveNewModel(db, newModel(projectId, ringText(4), 'Four'));
    expect((await listModels(db, projectId)).map((m) => m.id)).toEqual([other.id, model.id]);
    await saveModelVersion(db, model.id, versionOf(7));
    expect((await listModels(db, projectId)).map((m) => m.id)).toEqual([model.id, other.id]);
  });

  test('deleteModel removes the model, all its text versions and its runs, leaving siblings alone', async () => {
    const { db, projectId, model } = await setUp();
    const sibling = await saveNewModel(db, newModel(projectId, ringText(4), 'Four'));
    await saveModelVersion(db, model.id, versionOf(5));
    await saveRun(db, {
      modelId: model.id,
      projectId,
      modelVersion: 2,
      modelHash: model.hash,
      engineVersion: 'test',
      settings: { method: 'direct', field: { kind: 'rational' }, splitBlocks: false },
      status: 'cancelled',
      ms: 3,
    });
    await deleteModel(db, model.id);
    expect(await getModel(db, model.id)).toBeUndefined();
    expect(await db.modelTexts.where('modelId').equals(model.id).count()).toBe(0);
    expect(await listRuns(db, model.id)).toEqual([]);
    expect((await listModels(db, projectId)).map((m) => m.id)).toEqual([sibling.id]);
    await expect(loadModelText(db, model.id)).rejects.toMatchObject({ code: 'not-found' });
    await deleteModel(db, model.id); // again: a no-op
  });
});
