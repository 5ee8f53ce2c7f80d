/** Importing any supported file, dispatched by detectFormat (shared/import/importAny.ts). */
import { describe, expect, test } from 'vitest';
import { importAny } from '../../shared/import';
import { TETRAHEDRON_OBJ, TETRAHEDRON_OFF } from './fixtures/meshText';

describe('importAny', () => {
  test('dispatches by extension and names the model after the file', () => {
    for (const [name, text] of [
      ['tet.obj', TETRAHEDRON_OBJ],
      ['tet.off', TETRAHEDRON_OFF],
      ['tet.csv', '0,2,1\n0,1,3\n0,3,2\n1,2,3\n'],
    ]) {
      const r = importAny(`/uploads/${name}`, text);
      if (!('model' in r)) throw new Error(`${name}: ${JSON.stringify(r.problems)}`);
      expect(r.model.name).toBe('tet');
      expect(r.model.simplices).toEqual([[0, 2, 1], [0, 1, 3], [0, 3, 2], [1, 2, 3]]);
    }
  });

  test('dispatches by content without an extension, and keeps a given name and stalk dimension', () => {
    const r = importAny('upload', TETRAHEDRON_OFF, { name: 'mine', stalkDim: 2 });
    if (!('model' in r)) throw new Error(JSON.stringify(r.problems));
    expect([r.model.name, r.model.stalks]).toEqual(['mine', { default: 2 }]);
  });

  test('returns a model file as written, options aside', () => {
    const json = { format: 'gluefield.sheaf', version: 1, simplices: [[0, 1]] };
    expect(importAny('edge.sheaf.json', JSON.stringify(json), { name: 'ignored' })).toEqual({ model: json });
  });

  test('passes on the chosen importer’s problems', () => {
    expect(importAny('bad.csv', '0,1\n0,x\n')).toEqual({ problems: [{ where: 'line 2, column 2', message: '"x" is not a vertex id' }] });
  });

  test('reports a file it cannot place', () => {
    const r = importAny('notes.md', 'just words\n');
    expect('problems' in r && r.problems[0].message).toMatch(/cannot tell the kind of "notes.md"/);
  });
});
