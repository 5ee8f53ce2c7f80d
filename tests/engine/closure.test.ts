import { describe, expect, test } from 'vitest';
import { cohomology } from '../../shared/engine';

const model = (simplices: number[][]) => ({ format: 'gluefield.sheaf', version: 1, simplices });

describe('the closure of the listed simplices', () => {
  test('a triangle listed twice, in two vertex orders, is one triangle (the closure is a set)', () => {
    const once = cohomology(model([[0, 1, 2]]));
    const twice = cohomology(model([[0, 1, 2], [2, 0, 1]]));
    expect(twice.cells).toEqual(once.cells);
    expect(twice.cells).toEqual([3, 3, 1]);
  });

  test('edges listed beside the triangles that contain them are not counted again', () => {
    const r = cohomology(model([[0, 1, 2], [1, 2], [0, 2], [2, 3]]));
    expect(r.cells).toEqual([4, 4, 1]);
    // A disc with a whisker is contractible (Hatcher 2002, ch. 0).
    expect(r.dims).toEqual([1, 0, 0]);
  });

  test('the boundary of a tetrahedron listed face by face with repeats is the 2-sphere (Hatcher 2002: 1, 0, 1)', () => {
    const faces = [[0, 1, 2], [0, 1, 3], [0, 2, 3], [1, 2, 3], [3, 2, 1], [1, 0, 3]];
    const r = cohomology(model(faces));
    expect(r.cells).toEqual([4, 6, 4]);
    expect(r.dims).toEqual([1, 0, 1]);
  });
});
