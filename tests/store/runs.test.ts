import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import { cohomology } from '../../shared/engine';
import { createProject, deleteRun, getRun, listRuns, saveNewModel, saveRun, type NewRun } from '../../src/store';
import { freshDb, newModel, ringText } from './helpers';

async function setUp() {
  const db = freshDb();
  const project = await createProject(db, 'Survey');
  const model = await saveNewModel(db, newModel(project.id, ringText(4)));
  const report = cohomology(JSON.parse(ringText(4)));
  const run: NewRun = {
    modelId: model.id,
    projectId: project.id,
    modelVersion: model.version,
    modelHash: model.hash,
    engineVersion: '0.1.0',
    settings: { method: 'morse', field: { kind: 'rational' }, splitBlocks: true },
    status: 'done',
    report,
    bases: [{ degree: 0, dim: 1, values: [Float64Array.of(1, 1, 1, 1)] }],
    ms: 12.5,
  };
  return { db, model, run };
}

describe('runs', () => {
  test('saveRun keeps the report and bases; getRun returns them with Float64Array values intact', async () => {
    const { db, run } = await setUp();
    const saved = await saveRun(db, run);
    expect(saved.id).toMatch(/^[0-9a-f-]{36}$/);
    const back = await getRun(db, saved.id);
    expect(back).toEqual(saved);
    expect(back?.report?.dims).toEqual([1, 1]);
    expect(back?.bases?.[0].values[0]).toBeInstanceOf(Float64Array);
    expect(Array.from(back!.bases![0].values[0])).toEqual([1, 1, 1, 1]);
  });

  test('listRuns lists a model\'s runs newest first, even when saved within one millisecond', async () => {
    const { db, run } = await setUp();
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) ids.push((await saveRun(db, { ...run, ms: i })).id);
    expect((await listRuns(db, run.modelId)).map((r) => r.id)).toEqual(ids.reverse());
  });

  test('deleteRun removes one run', async () => {
    const { db, run } = await setUp();
    const a = await saveRun(db, run);
    const b = await saveRun(db, { ...run, status: 'cancelled', report: undefined });
    await deleteRun(db, a.id);
    expect((await listRuns(db, run.modelId)).map((r) => r.id)).toEqual([b.id]);
    expect(await getRun(db, a.id)).toBeUndefined();
  });

  test('a run of a deleted or unknown model is StoreError not-found; malformed runs are invalid', async () => {
    const { db, run } = await setUp();
    await expect(saveRun(db, { ...run, modelId: 'gone' })).rejects.toMatchObject({ code: 'not-found' });
    await expect(saveRun(db, { ...run, projectId: 'elsewhere' })).rejects.toMatchObject({ code: 'invalid' });
    await expect(saveRun(db, { ...run, status: 'maybe' as never })).rejects.toMatchObject({ code: 'invalid' });
    await expect(saveRun(db, { ...run, settings: { ...run.settings, method: 'fast' as never } })).rejects.toMatchObject({ code: 'invalid' });
    await expect(saveRun(db, { ...run, report: undefined })).rejects.toMatchObject({ code: 'invalid' });
    expect(await db.runs.count()).toBe(0);
  });
});
