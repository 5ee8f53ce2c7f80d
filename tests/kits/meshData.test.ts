/**
 * The mesh kit's typed-array path (`readObj`/`readOff` → `analyseMeshData`)
 * gives the same report as the model-file path it replaced in the app and
 * the command line (`importObj` → `analyseMesh`), on random meshes with
 * repeated, reversed and non-manifold triangles, polylines and unused
 * vertices, over GF(2) and the rationals.
 */
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { meshModel, readObj, type MeshData } from '../../shared/import';
import { analyseMesh, analyseMeshData, type MeshReport } from '../../shared/kits';
import { torus, toObj } from './meshText';

const withoutTimes = (r: MeshReport) => ({ ...r, ms: undefined });

const randomMesh = fc
  .integer({ min: 3, max: 9 })
  .chain((n) =>
    fc.record({
      n: fc.constant(n),
      triangles: fc.array(fc.uniqueArray(fc.integer({ min: 0, max: n - 1 }), { minLength: 3, maxLength: 3 }), { maxLength: 14 }),
      edges: fc.array(fc.uniqueArray(fc.integer({ min: 0, max: n - 1 }), { minLength: 2, maxLength: 2 }), { maxLength: 4 }),
    }),
  )
  .map(({ n, triangles, edges }): MeshData => ({
    vertexCount: n,
    positions: Float64Array.from({ length: 3 * n }, (_, i) => i % 7),
    triangles: Int32Array.from(triangles.flat()),
    edges: Int32Array.from(edges.flat()),
  }));

/** The winding rule written plainly: no edge is run twice in the same direction (common practice for oriented meshes). */
function runsEachEdgeOnceEachWay(t: Int32Array): boolean {
  const runs = new Set<string>();
  for (let i = 0; i < t.length; i += 3) {
    for (let k = 0; k < 3; k++) {
      const key = `${t[i + k]}>${t[i + ((k + 1) % 3)]}`;
      if (runs.has(key)) return false;
      runs.add(key);
    }
  }
  return true;
}

describe('analyseMeshData', () => {
  test('equals analyseMesh on the model file of the same mesh (random meshes, both fields, with cycles)', () => {
    fc.assert(
      fc.property(randomMesh, fc.constantFrom({ kind: 'prime', p: 2 } as const, { kind: 'rational' } as const), (mesh, field) => {
        const typed = analyseMeshData(mesh, { field });
        const model = analyseMesh(meshModel(mesh, { field }), { field });
        expect(withoutTimes(typed)).toEqual(withoutTimes(model));
        if (typed.windingConsistent !== null) expect(typed.windingConsistent).toBe(runsEachEdgeOnceEachWay(mesh.triangles));
      }),
      { numRuns: 300 },
    );
  });

  test('a torus read from OBJ: Betti (1, 2, 1), consistently wound (Hatcher 2002, ch. 2)', () => {
    const read = readObj(toObj(36, torus(6)));
    if (!('mesh' in read)) throw new Error(JSON.stringify(read.problems));
    const r = analyseMeshData(read.mesh);
    expect(r.betti).toEqual([1, 2, 1]);
    expect(r.windingConsistent).toBe(true);
  });

  test('one triangle listed against the others’ winding: not consistently wound, still orientable', () => {
    const t = torus(6);
    t[7] = [t[7][1], t[7][0], t[7][2]];
    const read = readObj(toObj(36, t));
    if (!('mesh' in read)) throw new Error(JSON.stringify(read.problems));
    const r = analyseMeshData(read.mesh);
    expect(r.windingConsistent).toBe(false);
    expect(r.orientable).toBe(true);
  });
});
