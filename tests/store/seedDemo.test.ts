import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import { cohomology } from '../../shared/engine';
import { demoModels } from '../../shared/demo';
import {
  DEMO_PROJECT_NAME,
  deleteProject,
  getSetting,
  listModels,
  listProjects,
  loadModelText,
  seedDemoIfEmpty,
  createProject,
} from '../../src/store';
import { freshDb, summarize } from './helpers';

describe('seedDemoIfEmpty', () => {
  test('on an empty database it creates one demo project holding every demo scenario, in demo order', async () => {
    const db = freshDb();
    const project = await seedDemoIfEmpty(db, summarize);
    expect(project?.name).toBe(DEMO_PROJECT_NAME);
    expect(await listProjects(db)).toEqual([project]);
    const models = await listModels(db, project!.id);
    const demos = demoModels();
    expect(models.map((m) => m.name)).toEqual(demos.map((d) => d.model.name));
    expect(models.every((m) => m.source === 'demo' && m.version === 1)).toBe(true);
    expect(await getSetting(db, 'demoSeeded', false)).toBe(true);
    // Each stored text is the demo model itself, and computes as designed.
    const text = await loadModelText(db, models[0].id);
    expect(JSON.parse(text)).toEqual(demos[0].model);
    expect(cohomology(JSON.parse(text)).dims).toEqual([1, 3]);
  });

  test('is idempotent: a second call, or two at once, seed only one project', async () => {
    const db = freshDb();
    const [a, b] = await Promise.all([seedDemoIfEmpty(db, summarize), seedDemoIfEmpty(db, summarize)]);
    expect([a, b].filter(Boolean)).toHaveLength(1);
    expect(await seedDemoIfEmpty(db, summarize)).toBeUndefined();
    expect(await listProjects(db)).toHaveLength(1);
    expect(await db.models.count()).toBe(demoModels().length);
    expect(await db.modelTexts.count()).toBe(demoModels().length);
  });

  test('does not come back after the demo project is deleted, and never seeds next to existing projects', async () => {
    const db = freshDb();
    const demo = await seedDemoIfEmpty(db, summarize);
    await deleteProject(db, demo!.id);
    expect(await seedDemoIfEmpty(db, summarize)).toBeUndefined();
    expect(await listProjects(db)).toEqual([]);

    const other = freshDb();
    await createProject(other, 'Mine');
    expect(await seedDemoIfEmpty(other, summarize)).toBeUndefined();
    expect((await listProjects(other)).map((p) => p.name)).toEqual(['Mine']);
  });

  test('a failing summarize writes nothing, so the next start can try again', async () => {
    const db = freshDb();
    await expect(seedDemoIfEmpty(db, () => { throw new Error('engine not ready'); })).rejects.toThrow('engine not ready');
    expect(await db.projects.count()).toBe(0);
    expect(await getSetting(db, 'demoSeeded', false)).toBe(false);
    expect(await seedDemoIfEmpty(db, summarize)).toBeDefined();
  });
});
