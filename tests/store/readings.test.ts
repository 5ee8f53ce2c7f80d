import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import { createProject, deleteModel, deleteProject, listReadings, loadReadingsText, openDb, saveNewModel, saveReadings, StoreError, updateReadings } from '../../src/store';

let n = 0;
const fresh = () => openDb(`readings-test-${n++}`);
const summary = { field: 'rational', cells: [3, 3], cochainDims: [3, 3] };

describe('readings kept with a model', () => {
  test('a readings file round-trips packed and is listed with its model', async () => {
    const db = fresh();
    const p = await createProject(db, 'Ring');
    const m = await saveNewModel(db, { projectId: p.id, name: 'ring', text: '{"format":"gluefield.sheaf"}', source: 'model', ...summary });
    const text = JSON.stringify({ format: 'gluefield.readings', version: 1, values: [{ cell: [0], value: [1.5] }] });
    const r = await saveReadings(db, { modelId: m.id, name: 'week 3', text, count: 1 });
    expect(r.projectId).toBe(p.id);
    expect(await loadReadingsText(db, r.id)).toBe(text);
    expect((await listReadings(db, m.id)).map((x) => x.name)).toEqual(['week 3']);
  });

  test('readings for an unknown model are refused before anything is written', async () => {
    const db = fresh();
    await expect(saveReadings(db, { modelId: 'nope', name: 'x', text: '{}', count: 0 })).rejects.toBeInstanceOf(StoreError);
    expect(await db.readings.count()).toBe(0);
  });

  test('deleting the model or the project deletes its readings', async () => {
    const db = fresh();
    const p = await createProject(db, 'Ring');
    const a = await saveNewModel(db, { projectId: p.id, name: 'a', text: '{"x":1}', source: 'model', ...summary });
    const b = await saveNewModel(db, { projectId: p.id, name: 'b', text: '{"x":2}', source: 'model', ...summary });
    await saveReadings(db, { modelId: a.id, name: 'r', text: '{}', count: 0 });
    await saveReadings(db, { modelId: b.id, name: 'r', text: '{}', count: 0 });
    await deleteModel(db, a.id);
    expect(await db.readings.count()).toBe(1);
    await deleteProject(db, p.id);
    expect(await db.readings.count()).toBe(0);
  });

  test('a readings file is renamed or given a new text with its count; a text without its count is refused and changes nothing', async () => {
    const db = fresh();
    const p = await createProject(db, 'Ring');
    const m = await saveNewModel(db, { projectId: p.id, name: 'ring', text: '{"x":1}', source: 'model', ...summary });
    const r = await saveReadings(db, { modelId: m.id, name: 'week 3', text: '{"values":[1]}', count: 1 });
    const renamed = await updateReadings(db, r.id, { name: ' week 3 (checked) ' });
    expect(renamed.name).toBe('week 3 (checked)');
    expect(await loadReadingsText(db, r.id)).toBe('{"values":[1]}');
    await expect(updateReadings(db, r.id, { text: '{"values":[1,2]}' })).rejects.toThrow('comes with its count');
    const replaced = await updateReadings(db, r.id, { text: '{"values":[1,2]}', count: 2 });
    expect([replaced.count, replaced.bytes, replaced.name]).toEqual([2, 16, 'week 3 (checked)']);
    expect(await loadReadingsText(db, r.id)).toBe('{"values":[1,2]}');
    await expect(updateReadings(db, 'nope', { name: 'x' })).rejects.toThrow('not found');
  });
});
