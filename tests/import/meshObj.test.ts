/**
 * The Wavefront OBJ importer (shared/import/meshObj.ts): positions, faces
 * in every corner form, relative indices, polylines, fan triangulation,
 * the statements it skips, and a located problem for each defect.
 * Format reference: Wavefront Technologies, "Object Files (.obj)",
 * Advanced Visualizer manual, appendix B1.
 */
import { describe, expect, test } from 'vitest';
import type { ModelFile, Problem } from '../../shared/engine';
import { importObj } from '../../shared/import';
import { gridObj, TETRAHEDRON_OBJ } from './fixtures/meshText';

function model(text: string, options?: Parameters<typeof importObj>[1]): ModelFile {
  const r = importObj(text, options);
  if (!('model' in r)) throw new Error(`expected a model, got ${JSON.stringify(r.problems)}`);
  return r.model;
}

function problems(text: string): Problem[] {
  const r = importObj(text);
  if (!('problems' in r)) throw new Error('expected problems');
  return r.problems;
}

const SQUARE = 'v 0 0 0\nv 1 0 0\nv 1 1 0\nv 0 1 0\n';

describe('importObj reads', () => {
  test('a tetrahedron surface: 0-based triangles, positions, a constant sheaf', () => {
    const m = model(TETRAHEDRON_OBJ);
    expect(m.simplices).toEqual([[0, 2, 1], [0, 1, 3], [0, 3, 2], [1, 2, 3]]);
    expect(m.vertices).toEqual([
      { id: 0, x: 0, y: 0, z: 0 },
      { id: 1, x: 1, y: 0, z: 0 },
      { id: 2, x: 0, y: 1, z: 0 },
      { id: 3, x: 0, y: 0, z: 1 },
    ]);
    expect(m.stalks).toEqual({ default: 1 });
    expect(m.maps).toEqual({ default: 'identity' });
    expect(m.field).toEqual({ kind: 'rational' });
  });

  test('a quad as two triangles fanned from its first corner', () => {
    expect(model(`${SQUARE}f 1 2 3 4\n`).simplices).toEqual([[0, 1, 2], [0, 2, 3]]);
  });

  test('a pentagon as three triangles', () => {
    expect(model(`${SQUARE}v 0.5 1.5 0\nf 1 2 3 5 4\n`).simplices).toEqual([[0, 1, 2], [0, 2, 4], [0, 4, 3]]);
  });

  test('corners written v, v/vt, v/vt/vn and v//vn', () => {
    expect(model(`${SQUARE}vt 0 0\nvn 0 0 1\nf 1/1 2/1/1 3//1\nf 1//1 3 4/1\n`).simplices).toEqual([[0, 1, 2], [0, 2, 3]]);
  });

  test('negative indices counted back from the last vertex read', () => {
    expect(model(`${SQUARE}f -4 -3 -2\nv 2 2 0\nf -1 -2 -3\n`).simplices).toEqual([[0, 1, 2], [4, 3, 2]]);
  });

  test('"l" polylines as edges', () => {
    expect(model(`${SQUARE}l 1 2 3\nl 4/1 1/1\n`).simplices).toEqual([[0, 1], [1, 2], [3, 0]]);
  });

  test('scientific notation, signs, extra w values, and the statements it ignores', () => {
    const m = model(
      [
        'mtllib scene.mtl # materials',
        'o thing',
        'g part',
        's off',
        'usemtl red',
        'v -1.5e0 +2.25 .5 1.0',
        'v 1E-3 0. -0',
        'vt 0.5 0.5',
        'vn 0 0 1',
        'vp 0.1',
        'v 0 1 0 0.2 0.3 0.4',
        '  # an indented comment',
        'f 1 2 3 # trailing comment',
      ].join('\r\n'),
    );
    expect(m.simplices).toEqual([[0, 1, 2]]);
    expect(m.vertices?.[0]).toEqual({ id: 0, x: -1.5, y: 2.25, z: 0.5 });
    expect(m.vertices?.[1]).toEqual({ id: 1, x: 0.001, y: 0, z: -0 });
  });

  test('vertices no face uses as isolated points', () => {
    expect(model(`${SQUARE}f 1 2 3\n`).simplices).toEqual([[0, 1, 2], [3]]);
  });

  test('a face before the vertices it names', () => {
    expect(model('f 1 2 3\nv 0 0 0\nv 1 0 0\nv 0 1 0\n').simplices).toEqual([[0, 1, 2]]);
  });

  test('the options into the model', () => {
    const m = model(TETRAHEDRON_OBJ, { name: 'tet', field: { kind: 'real' }, stalkDim: 3 });
    expect([m.name, m.field, m.stalks]).toEqual(['tet', { kind: 'real' }, { default: 3 }]);
  });

  test('a 10^5-triangle grid (size check; no timing)', () => {
    const n = 224;
    const m = model(gridObj(n));
    expect(m.simplices).toHaveLength(2 * n * n);
    expect(m.vertices).toHaveLength((n + 1) ** 2);
    const last = (n + 1) ** 2 - 1;
    expect(m.simplices[m.simplices.length - 1]).toEqual([last - n - 2, last, last - 1]);
  });
});

describe('importObj reports, located by line', () => {
  test('an index past the last vertex', () => {
    expect(problems(`${SQUARE}f 1 2 3\nf 1 2 9\n`)).toEqual([
      { where: 'line 6', message: 'vertex index 9 is out of range: the file has 4 vertices' },
    ]);
  });

  test('index 0 and a negative index before the first vertex', () => {
    expect(problems(`${SQUARE}f 0 1 2\nf -5 1 2\n`)).toEqual([
      { where: 'line 5', message: 'vertex index 0 is out of range: OBJ counts vertices from 1' },
      { where: 'line 6', message: 'vertex index -5 is out of range: only 4 vertices precede it' },
    ]);
  });

  test('a face with fewer than 3 vertices', () => {
    expect(problems(`${SQUARE}f 1 2\n`)).toEqual([{ where: 'line 5', message: 'a face needs at least 3 vertices, got 2' }]);
  });

  test('a degenerate face (a repeated index, also through a relative one)', () => {
    expect(problems(`${SQUARE}f 1 2 1\nf 4 1 -1\n`)).toEqual([
      { where: 'line 5', message: 'degenerate face: vertex 1 appears twice' },
      { where: 'line 6', message: 'degenerate face: vertex 4 appears twice' },
    ]);
  });

  test('malformed numbers in a position', () => {
    expect(problems('v 0 0 0\nv 1 x 0\nv 1 1 1e\nv nan 0 0\nv 0x1 0 0\nv 1e999 0 0\n')).toEqual([
      { where: 'line 2', message: '"x" is not a number' },
      { where: 'line 3', message: '"1e" is not a number' },
      { where: 'line 4', message: '"nan" is not a number' },
      { where: 'line 5', message: '"0x1" is not a number' },
      { where: 'line 6', message: '"1e999" is not a number' },
    ]);
  });

  test('a position with fewer than three coordinates', () => {
    expect(problems('v 0 0\n')).toEqual([{ where: 'line 1', message: 'a vertex needs three coordinates "v x y z"' }]);
  });

  test('malformed corners', () => {
    expect(problems(`${SQUARE}f 1.5 2 3\nf 1/ 2 3\nf 1/2/3/4 2 3\nf a 2 3\n`).map((p) => p.where)).toEqual([
      'line 5',
      'line 6',
      'line 7',
      'line 8',
    ]);
    expect(problems(`${SQUARE}f 1.5 2 3\n`)[0].message).toBe('"1.5" is not a vertex reference');
  });

  test('a polyline of one vertex, and one that stays in place', () => {
    expect(problems(`${SQUARE}l 1\nl 1 1\n`)).toEqual([
      { where: 'line 5', message: 'a line needs at least 2 vertices, got 1' },
      { where: 'line 6', message: 'degenerate line: vertex 1 follows itself' },
    ]);
  });

  test('an empty file, and one without vertices', () => {
    expect(problems('')).toEqual([{ where: 'line 1', message: 'the file is empty' }]);
    expect(problems('# nothing\n\n')).toEqual([{ where: 'line 1', message: 'the file is empty' }]);
    expect(problems('o thing\n')).toEqual([{ where: 'line 1', message: 'the file has no vertices ("v" lines)' }]);
  });

  test('problems in line order, forward references included, at most 50', () => {
    const p = problems('f 1 2 7\nv 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 1 2\n');
    expect(p.map((q) => q.where)).toEqual(['line 1', 'line 5']);
    expect(problems(`${SQUARE}${'f 1 1 2\n'.repeat(80)}`)).toHaveLength(50);
  });
});
