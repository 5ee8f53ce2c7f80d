/**
 * The mesh-topology kit on standard surfaces imported from OBJ and OFF
 * text. Betti numbers over the rationals and GF(2) from A. Hatcher,
 * Algebraic Topology (2002), ch. 2 and §3.1 (check-values.md, "Topology of
 * standard spaces"): sphere (1, 0, 1); torus (1, 2, 1); closed surface of
 * genus 2 (1, 4, 1); Klein bottle (1, 1, 0) over Q and (1, 2, 1) over
 * GF(2); real projective plane (1, 0, 0) and (1, 1, 1); two disjoint
 * spheres, an outer wall around an inner one as a mesh with a void,
 * (2, 0, 2). The Möbius strip is the textbook non-orientable surface with
 * boundary; the cycles reported are checked to be cycles and independent
 * of the boundaries by an elimination written here.
 */
import { describe, expect, test } from 'vitest';
import { importAny } from '../../shared/import';
import { analyseMesh, type MeshOptions, type MeshReport } from '../../shared/kits';
import { projectivePlane } from '../engine/fixtures/triangulations';
import { genusTwo, kleinBottle, moebius, tetrahedron, toObj, toOff, torus, type Tri } from './meshText';

const RATIONAL: MeshOptions = { field: { kind: 'rational' } };

function analyse(text: string, name: string, options: MeshOptions = {}): MeshReport {
  const imported = importAny(name, text);
  if (!('model' in imported)) throw new Error(JSON.stringify(imported.problems));
  return analyseMesh(imported.model, options);
}

const vertexCount = (t: Tri[]) => Math.max(...t.flat()) + 1;
const obj = (t: Tri[], n = vertexCount(t)) => toObj(n, t);

/** Rank over GF(2) of 0/1 vectors given as sets of positions (Gaussian elimination on bitsets). */
function rankGF2(vectors: Set<string>[], keys: string[]): number {
  const index = new Map(keys.map((k, i) => [k, i]));
  const rows = vectors.map((v) => {
    const bits = new Uint8Array(keys.length);
    for (const k of v) bits[index.get(k)!] ^= 1;
    return bits;
  });
  let rank = 0;
  for (let c = 0; c < keys.length && rank < rows.length; c++) {
    const p = rows.findIndex((r, i) => i >= rank && r[c] === 1);
    if (p < 0) continue;
    [rows[rank], rows[p]] = [rows[p], rows[rank]];
    for (let i = 0; i < rows.length; i++) if (i !== rank && rows[i][c]) for (let j = 0; j < keys.length; j++) rows[i][j] ^= rows[rank][j];
    rank++;
  }
  return rank;
}

/** The GF(2) boundary of a set of k-simplices, as (k−1)-face keys appearing an odd number of times. */
function boundaryGF2(cells: number[][]): Set<string> {
  const odd = new Set<string>();
  for (const c of cells) {
    for (let i = 0; i < c.length; i++) {
      const key = c.filter((_, j) => j !== i).join(',');
      if (odd.has(key)) odd.delete(key);
      else odd.add(key);
    }
  }
  return odd;
}

/** Over GF(2): the reported 1-cycles are cycles and independent modulo the boundaries of triangles. */
function checkCyclesGF2(report: MeshReport, triangles: Tri[]): void {
  const loops = report.cycles.filter((c) => c.degree === 1);
  expect(loops).toHaveLength(report.betti[1]);
  for (const loop of loops) expect(boundaryGF2(loop.cells).size).toBe(0);
  const tris = triangles.map((t) => [...t].sort((a, b) => a - b));
  const boundaries = tris.map((t) => boundaryGF2([t]));
  const edges = [...new Set([...boundaries.flatMap((b) => [...b]), ...loops.flatMap((l) => l.cells.map((c) => c.join()))])];
  const loopSets = loops.map((l) => new Set(l.cells.map((c) => c.join())));
  expect(rankGF2([...boundaries, ...loopSets], edges) - rankGF2(boundaries, edges)).toBe(report.betti[1]);
  // H_2 has no boundaries to divide by (no 3-cells): the shells must be independent outright.
  const shells = report.cycles.filter((c) => c.degree === 2);
  expect(shells).toHaveLength(report.betti[2]);
  for (const shell of shells) expect(boundaryGF2(shell.cells).size).toBe(0);
  const shellSets = shells.map((c) => new Set(c.cells.map((t) => t.join())));
  expect(rankGF2(shellSets, tris.map((t) => t.join()))).toBe(report.betti[2]);
}

describe('Betti numbers of standard meshes (Hatcher 2002)', () => {
  test('sphere (tetrahedron boundary, OBJ): (1, 0, 1), closed, orientable, wound consistently', () => {
    const r = analyse(obj(tetrahedron()), 'sphere.obj');
    expect(r.betti).toEqual([1, 0, 1]);
    expect(r).toMatchObject({ components: 1, closed: true, orientable: true, windingConsistent: true, euler: 2 });
    expect(analyse(obj(tetrahedron()), 'sphere.obj', RATIONAL).betti).toEqual([1, 0, 1]);
  });
  test('sphere as an OFF octahedron: (1, 0, 1)', () => {
    const oct: Tri[] = [[0, 2, 4], [2, 1, 4], [1, 3, 4], [3, 0, 4], [2, 0, 5], [1, 2, 5], [3, 1, 5], [0, 3, 5]];
    const r = analyse(toOff(6, oct), 'octahedron.off');
    expect(r.betti).toEqual([1, 0, 1]);
    expect(r.closed).toBe(true);
    expect(r.windingConsistent).toBe(true);
  });
  test('torus: (1, 2, 1) over GF(2) and Q, two independent tunnel loops and the closed shell', () => {
    const t = torus(5);
    const r = analyse(obj(t), 'torus.obj');
    expect(r.betti).toEqual([1, 2, 1]);
    expect(r).toMatchObject({ closed: true, orientable: true, windingConsistent: true, euler: 0 });
    checkCyclesGF2(r, t);
    const q = analyse(obj(t), 'torus.obj', RATIONAL);
    expect(q.betti).toEqual([1, 2, 1]);
    // Over Q every reported cycle has zero boundary with its signed coefficients.
    for (const cyc of q.cycles) {
      const sum = new Map<string, number>();
      cyc.cells.forEach((cell, i) => {
        cell.forEach((_, k) => {
          const face = cell.filter((__, j) => j !== k).join();
          sum.set(face, (sum.get(face) ?? 0) + (k % 2 === 0 ? 1 : -1) * Number(cyc.coefficients![i]));
        });
      });
      for (const x of sum.values()) expect(x).toBe(0);
    }
    // Over Q the shell is the whole surface with coefficients ±1 (the fundamental class).
    const shell = q.cycles.find((c) => c.degree === 2)!;
    expect(shell.cells).toHaveLength(50);
    expect(new Set(shell.coefficients!.map((x) => Math.abs(Number(x))))).toEqual(new Set([1]));
  });
  test('two-holed surface (connected sum of two tori): (1, 4, 1), χ = −2', () => {
    const g = genusTwo();
    const r = analyse(toObj(g.vertices, g.triangles), 'genus2.obj');
    expect([r.vertices, r.edges, r.triangles]).toEqual([47, 147, 98]);
    expect(r.betti).toEqual([1, 4, 1]);
    expect(r.euler).toBe(-2);
    expect(r).toMatchObject({ closed: true, orientable: true });
    checkCyclesGF2(r, g.triangles);
    expect(analyse(toObj(g.vertices, g.triangles), 'genus2.obj', RATIONAL).betti).toEqual([1, 4, 1]);
  });
  test('a mesh with a void (an outer wall around an inner sphere): (2, 0, 2), two closed shells', () => {
    const walls = [...tetrahedron(0), ...tetrahedron(4)];
    const r = analyse(obj(walls), 'void.obj');
    expect(r.betti).toEqual([2, 0, 2]);
    expect(r.components).toBe(2);
    expect(r.closed).toBe(true);
    expect(r.cycles.filter((c) => c.degree === 2)).toHaveLength(2);
    checkCyclesGF2(r, walls);
    expect(analyse(obj(walls), 'void.obj', RATIONAL).betti).toEqual([2, 0, 2]);
  });
  test('Klein bottle: (1, 1, 0) over Q and (1, 2, 1) over GF(2); closed, not orientable', () => {
    const k = kleinBottle(5);
    const q = analyse(obj(k), 'klein.obj', RATIONAL);
    const two = analyse(obj(k), 'klein.obj');
    expect(q.betti).toEqual([1, 1, 0]);
    expect(two.betti).toEqual([1, 2, 1]);
    expect(two).toMatchObject({ closed: true, orientable: false });
    checkCyclesGF2(two, k);
  });
  test('real projective plane: (1, 0, 0) over Q and (1, 1, 1) over GF(2); closed, not orientable', () => {
    const rp = projectivePlane() as Tri[];
    expect(analyse(obj(rp), 'rp2.obj', RATIONAL).betti).toEqual([1, 0, 0]);
    const two = analyse(obj(rp), 'rp2.obj');
    expect(two.betti).toEqual([1, 1, 1]);
    expect(two).toMatchObject({ closed: true, orientable: false });
    checkCyclesGF2(two, rp);
  });
});

describe('orientability and closedness', () => {
  test('a Möbius strip is not orientable, not closed, one loop: (1, 1, 0) with a 5-edge border', () => {
    const r = analyse(obj(moebius()), 'moebius.obj');
    expect(r.betti).toEqual([1, 1, 0]);
    expect(r).toMatchObject({ orientable: false, closed: false, boundaryEdges: 5, nonManifoldEdges: 0 });
  });
  test('an annulus (a strip without the twist) is orientable with two border loops', () => {
    const annulus: Tri[] = [];
    for (let i = 0; i < 6; i++) annulus.push([i, (i + 1) % 6, 6 + i], [(i + 1) % 6, 6 + ((i + 1) % 6), 6 + i]);
    const r = analyse(obj(annulus), 'annulus.obj');
    expect(r.betti).toEqual([1, 1, 0]);
    expect(r).toMatchObject({ orientable: true, closed: false, boundaryEdges: 12 });
  });
  test('one triangle flipped: still orientable, but the file is not wound consistently', () => {
    const t = torus(5);
    t[7] = [t[7][0], t[7][2], t[7][1]];
    const r = analyse(obj(t), 'flipped.obj');
    expect(r.orientable).toBe(true);
    expect(r.windingConsistent).toBe(false);
  });
  test('three triangles on one edge: non-manifold, orientability undefined', () => {
    const r = analyse(obj([[0, 1, 2], [0, 1, 3], [0, 1, 4]]), 'fin.obj');
    expect(r.nonManifoldEdges).toBe(1);
    expect(r.orientable).toBeNull();
    expect(r.windingConsistent).toBeNull();
  });
  test('two spheres pinched at one vertex: every edge has two triangles, but the vertex is not a manifold point, so not closed', () => {
    const pinched = [...tetrahedron(0), ...tetrahedron(3)];
    const r = analyse(obj(pinched), 'pinched.obj');
    expect(r.betti).toEqual([1, 0, 2]);
    expect(r).toMatchObject({ nonManifoldEdges: 0, nonManifoldVertices: 1, closed: false, orientable: true });
    expect(analyse(obj(tetrahedron()), 'sphere.obj').nonManifoldVertices).toBe(0);
  });
  test('loose vertices and edges keep a mesh from being closed and count as components', () => {
    const text = obj(tetrahedron()) + 'v 9 9 9\nv 8 8 8\nv 7 7 7\nl 6 7\n';
    const r = analyse(text, 'loose.obj');
    expect(r.betti).toEqual([3, 0, 1]);
    expect(r).toMatchObject({ closed: false, looseVertices: 1, looseEdges: 1 });
  });
});
