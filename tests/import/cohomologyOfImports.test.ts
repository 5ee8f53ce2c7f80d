/**
 * End to end: imported meshes and simplex lists through the engine's
 * `cohomology`. Expected values: A. Hatcher, Algebraic Topology (2002),
 * ch. 2 — the 2-sphere has Betti numbers 1, 0, 1, the torus 1, 2, 1, the
 * disc 1, 0, 0, the circle 1, 1; a constant sheaf of dimension d
 * multiplies each by d (§3.1, universal coefficients over a field).
 */
import { describe, expect, test } from 'vitest';
import { cohomology, type ModelFile } from '../../shared/engine';
import { importObj, importOff, importSimplexCsv, type ImportResult } from '../../shared/import';
import { gridObj, TETRAHEDRON_OBJ, TETRAHEDRON_OFF, torusOff } from './fixtures/meshText';

function model(r: ImportResult): ModelFile {
  if (!('model' in r)) throw new Error(JSON.stringify(r.problems));
  return r.model;
}

describe('cohomology of imported files (Hatcher 2002)', () => {
  test('the tetrahedron surface from OBJ is a 2-sphere: [1, 0, 1]', () => {
    expect(cohomology(model(importObj(TETRAHEDRON_OBJ))).dims).toEqual([1, 0, 1]);
  });

  test('the tetrahedron surface from OFF is a 2-sphere: [1, 0, 1]', () => {
    expect(cohomology(model(importOff(TETRAHEDRON_OFF))).dims).toEqual([1, 0, 1]);
  });

  test('the 6×6 grid with identified sides, from OFF quads, is a torus: [1, 2, 1]', () => {
    const report = cohomology(model(importOff(torusOff(6))));
    expect(report.dims).toEqual([1, 2, 1]);
    expect(report.cells).toEqual([36, 108, 72]);
  });

  test('a 2-dimensional constant sheaf on the torus doubles every dimension, in GF(2) too', () => {
    const m = model(importOff(torusOff(6), { stalkDim: 2, field: { kind: 'prime', p: 2 } }));
    expect(cohomology(m).dims).toEqual([2, 4, 2]);
  });

  test('a triangulated square from OBJ is a disc: [1, 0, 0]', () => {
    expect(cohomology(model(importObj(gridObj(8)))).dims).toEqual([1, 0, 0]);
  });

  test('the edges of a triangle from CSV form a circle: [1, 1]', () => {
    expect(cohomology(model(importSimplexCsv('from;to\n0;1\n1;2\n2;0\n'))).dims).toEqual([1, 1]);
  });
});
