import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import { createProject, getModel, hashText, loadModelText, openDb, saveNewModel } from '../../src/store';

/**
 * A triangulated torus on an n×n grid with opposite sides identified:
 * n² vertices, 3n² edges, 2n² triangles (Euler characteristic 0). Only
 * the triangles are listed; the closure adds the rest.
 */
function torusText(n: number): string {
  const v = (i: number, j: number) => (i % n) * n + (j % n);
  const tri: string[] = [];
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      tri.push(`[${v(i, j)},${v(i + 1, j)},${v(i + 1, j + 1)}]`, `[${v(i, j)},${v(i, j + 1)},${v(i + 1, j + 1)}]`);
    }
  return `{"format":"gluefield.sheaf","version":1,"name":"Torus ${n}x${n}","simplices":[${tri.join(',')}]}`;
}

describe('a model of about 10^6 cells', () => {
  test('is stored as one packed text row and reads back identical from a new connection', async () => {
    const n = 408;
    const cells = [n * n, 3 * n * n, 2 * n * n];
    expect(cells.reduce((a, b) => a + b)).toBe(998_784);
    const text = torusText(n);
    const name = `gluefield-test-${crypto.randomUUID()}`;

    const first = openDb(name);
    const project = await createProject(first, 'Mesh');
    const model = await saveNewModel(first, { projectId: project.id, name: 'Torus', text, source: 'model', field: 'rational', cells, cochainDims: cells });
    first.close();

    const second = openDb(name);
    const back = await loadModelText(second, model.id);
    expect(back.length).toBe(text.length);
    expect(await hashText(back)).toBe(model.hash);
    expect(back === text).toBe(true);
    expect((await getModel(second, model.id))?.cells).toEqual(cells);
    expect(await second.modelTexts.where('modelId').equals(model.id).count()).toBe(1);
    expect(await second.modelTexts.count()).toBe(1);
    const row = await second.modelTexts.get(`${model.id}@1`);
    expect(row!.bytes).toBe(text.length);
    expect(row!.packed.byteLength).toBeLessThan(text.length / 3);
    second.close();
  });
});
