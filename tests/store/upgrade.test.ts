import 'fake-indexeddb/auto';
import Dexie from 'dexie';
import { describe, expect, test } from 'vitest';
import { listRuns, loadModelText, openDb, packText } from '../../src/store';
import { ringText } from './helpers';

describe('schema upgrade 1 → 2', () => {
  test('runs gain the projectId of their model (indexed), models gain the bytes of their text; nothing is lost', async () => {
    const name = `gluefield-test-${crypto.randomUUID()}`;
    // The schema as version 1 shipped it, declared with plain Dexie.
    const v1 = new Dexie(name);
    v1.version(1).stores({
      projects: 'id, name, updatedAt',
      models: 'id, projectId, updatedAt',
      modelTexts: 'id, modelId, [modelId+version]',
      runs: 'id, modelId, createdAt',
      settings: 'key',
    });
    const text = ringText(4);
    await v1.table('projects').add({ id: 'p1', name: 'Survey', createdAt: 1, updatedAt: 1 });
    await v1.table('models').add({
      id: 'm1', projectId: 'p1', name: 'Ring', version: 1, hash: 'h', field: 'rational',
      cells: [4, 4], cochainDims: [4, 4], source: 'model', createdAt: 1, updatedAt: 1,
    });
    await v1.table('modelTexts').add({ id: 'm1@1', modelId: 'm1', version: 1, packed: await packText(text), bytes: text.length });
    const run = { modelVersion: 1, modelHash: 'h', engineVersion: '0.0.1', settings: { method: 'morse', field: { kind: 'rational' }, splitBlocks: true }, status: 'failed', error: 'x', ms: 1 };
    await v1.table('runs').bulkAdd([
      { ...run, id: 'r1', modelId: 'm1', createdAt: 2 },
      { ...run, id: 'r2', modelId: 'm1', createdAt: 3 },
      { ...run, id: 'r-orphan', modelId: 'gone', createdAt: 4 },
    ]);
    expect(v1.verno).toBe(1);
    v1.close();

    const db = openDb(name);
    await db.open();
    expect(db.verno).toBe(5);
    expect(await db.kitResults.count()).toBe(0);
    expect(await db.runs.where('projectId').equals('p1').primaryKeys()).toEqual(['r1', 'r2']);
    expect((await db.runs.get('r-orphan'))?.projectId).toBe('');
    expect((await db.models.get('m1'))?.bytes).toBe(text.length);
    expect((await listRuns(db, 'm1')).map((r) => r.id)).toEqual(['r2', 'r1']);
    expect(await loadModelText(db, 'm1')).toBe(text);
    expect(await db.projects.count()).toBe(1);
    db.close();
  });
});
