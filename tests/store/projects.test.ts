import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import {
  createProject,
  deleteProject,
  getProject,
  listModels,
  listProjects,
  listRuns,
  renameProject,
  saveModelVersion,
  saveNewModel,
  saveRun,
  StoreError,
} from '../../src/store';
import { freshDb, newModel, ringText, summarize } from './helpers';

describe('projects', () => {
  test('createProject stores a trimmed name with timestamps; listProjects shows the most recently changed first', async () => {
    const db = freshDb();
    const a = await createProject(db, '  Ridge survey  ');
    const b = await createProject(db, 'Footbridge');
    expect(a.name).toBe('Ridge survey');
    expect(a.createdAt).toBe(a.updatedAt);
    expect((await listProjects(db)).map((p) => p.id)).toEqual([b.id, a.id]);
    await renameProject(db, a.id, 'Ridge survey, week 3');
    const list = await listProjects(db);
    expect(list.map((p) => p.name)).toEqual(['Ridge survey, week 3', 'Footbridge']);
    expect(list[0].updatedAt).toBeGreaterThan(a.updatedAt);
  });

  test('an empty or blank name is refused with StoreError invalid and nothing is stored', async () => {
    const db = freshDb();
    for (const name of ['', '   ', 'x'.repeat(201)]) {
      await expect(createProject(db, name)).rejects.toMatchObject({ name: 'StoreError', code: 'invalid' });
    }
    expect(await listProjects(db)).toEqual([]);
    const p = await createProject(db, 'Kept');
    await expect(renameProject(db, p.id, ' ')).rejects.toBeInstanceOf(StoreError);
    expect((await getProject(db, p.id))?.name).toBe('Kept');
  });

  test('renaming an unknown project is StoreError not-found', async () => {
    const db = freshDb();
    await expect(renameProject(db, 'no-such-id', 'Name')).rejects.toMatchObject({ code: 'not-found' });
  });

  test('saving a model moves its project to the top of the Desk', async () => {
    const db = freshDb();
    const a = await createProject(db, 'A');
    await createProject(db, 'B');
    await saveNewModel(db, newModel(a.id));
    expect((await listProjects(db))[0].id).toBe(a.id);
  });

  test('deleteProject removes the project with its models, every text version and every run, and nothing else', async () => {
    const db = freshDb();
    const doomed = await createProject(db, 'Doomed');
    const kept = await createProject(db, 'Kept');
    const m1 = await saveNewModel(db, newModel(doomed.id));
    const m2 = await saveNewModel(db, newModel(doomed.id, ringText(5), 'Five'));
    await saveModelVersion(db, m1.id, { text: ringText(4), ...summarize(ringText(4)) });
    const other = await saveNewModel(db, newModel(kept.id));
    for (const m of [m1, m2, other]) {
      await saveRun(db, {
        modelId: m.id,
        projectId: m.projectId,
        modelVersion: 1,
        modelHash: m.hash,
        engineVersion: 'test',
        settings: { method: 'morse', field: { kind: 'rational' }, splitBlocks: true },
        status: 'failed',
        error: 'test',
        ms: 1,
      });
    }
    expect(await db.modelTexts.count()).toBe(4);

    await deleteProject(db, doomed.id);

    expect((await listProjects(db)).map((p) => p.id)).toEqual([kept.id]);
    expect(await listModels(db, doomed.id)).toEqual([]);
    expect(await db.models.count()).toBe(1);
    expect(await db.modelTexts.toCollection().primaryKeys()).toEqual([`${other.id}@1`]);
    expect(await listRuns(db, m1.id)).toEqual([]);
    expect(await listRuns(db, m2.id)).toEqual([]);
    expect(await listRuns(db, other.id)).toHaveLength(1);
  });

  test('a full disk (QuotaExceededError) becomes StoreError quota and stores nothing', async () => {
    const db = freshDb();
    const full = () => {
      throw new DOMException('simulated full disk', 'QuotaExceededError');
    };
    db.projects.hook('creating', full);
    await expect(createProject(db, 'Big')).rejects.toMatchObject({ name: 'StoreError', code: 'quota' });
    db.projects.hook('creating').unsubscribe(full);
    expect(await listProjects(db)).toEqual([]);
  });

  test('deleting an unknown project is a no-op', async () => {
    const db = freshDb();
    const p = await createProject(db, 'Kept');
    await deleteProject(db, 'no-such-id');
    expect(await listProjects(db)).toEqual([p]);
  });
});
