import { closeTriangleEdges } from './closeTriangleEdges';
import { SimplexTable } from './SimplexTable';
import { uniqueTriangles } from './uniqueTriangles';

/**
 * A finite simplicial complex closed under faces, every simplex oriented by
 * increasing vertex id.
 *
 * Vertices are renumbered densely in increasing id order (so orientation by
 * dense index equals orientation by id). Incidences are flat typed arrays:
 * `faces[k][s*(k+1)+i]` is the (k-1)-face of k-simplex s opposite its i-th
 * vertex, with incidence number (-1)^i. Cofaces are the transpose in CSR
 * form; an entry of `cofaceEntry[k]` is a position in `faces[k+1]`, so the
 * coface is `entry / (k+2)` and the sign comes from `entry % (k+2)`.
 */
export interface SimplicialComplex {
  /** Top dimension, -1 for the empty complex. */
  readonly dimension: number;
  /** Original vertex id of each dense vertex index. */
  readonly vertexIds: Float64Array;
  /** Per dimension k: the k-simplices as tuples of dense vertex indices. */
  readonly simplices: SimplexTable[];
  readonly faces: Int32Array[];
  readonly cofacePtr: Int32Array[];
  readonly cofaceEntry: Int32Array[];
}

export function cellCount(complex: SimplicialComplex, k: number): number {
  return complex.simplices[k]?.size ?? 0;
}

/**
 * Close a list of simplices (each a sorted tuple of dense vertex indices,
 * grouped by dimension) under faces and index all incidences.
 * `listed[k]` holds the listed k-simplices flat, k+1 entries each.
 */
export function buildComplex(listed: Int32Array[], vertexIds: Float64Array): SimplicialComplex {
  const top = listed.length - 1;
  const simplices: SimplexTable[] = [];
  // Every vertex of a listed simplex is a 0-simplex, and dense indices are
  // already 0 … n−1 in order: the vertex table is the identity.
  const identity = new Int32Array(vertexIds.length);
  for (let v = 0; v < identity.length; v++) identity[v] = v;
  simplices.push(SimplexTable.ofUnique(1, identity, identity.length));
  for (let k = 1; k <= top; k++) {
    if (k === 2 && top === 2) {
      simplices.push(SimplexTable.ofUnique(3, new Int32Array(0), 0)); // replaced below
      continue;
    }
    const n = listed[k].length / (k + 1);
    // A surface's edges are closed by bucketing below; this table holds only the listed ones.
    const fromAbove = k < top && !(k === 1 && top === 2) ? listed[k + 1].length : 0;
    simplices.push(new SimplexTable(k + 1, n + fromAbove));
  }
  for (let k = top; k >= 1; k--) {
    const table = simplices[k];
    const list = listed[k];
    if (k === 2 && top === 2) {
      // A surface (the common large case): its triangles come only from the list.
      const unique = uniqueTriangles(list, vertexIds.length);
      simplices[2] = SimplexTable.ofUnique(3, unique.verts, unique.count);
    } else for (let off = 0; off < list.length; off += k + 1) table.insert(list, off);
  }
  const faces: Int32Array[] = [new Int32Array(0)];
  const buf = new Int32Array(Math.max(top, 1));
  for (let k = top; k >= 1; k--) {
    const table = simplices[k];
    const lower = simplices[k - 1];
    const n = table.size;
    const verts = table.vertices;
    if (k === 2) {
      const closed = closeTriangleEdges(verts, n, lower, vertexIds.length);
      simplices[1] = closed.edges;
      faces[2] = closed.faces;
      continue;
    }
    const f = new Int32Array(n * (k + 1));
    if (k === 1) {
      // Faces of an edge (a, b): opposite a is b, opposite b is a.
      for (let s = 0; s < n; s++) {
        f[2 * s] = verts[2 * s + 1];
        f[2 * s + 1] = verts[2 * s];
      }
    } else {
      for (let s = 0; s < n; s++) {
        const base = s * (k + 1);
        for (let i = 0; i <= k; i++) {
          let w = 0;
          for (let j = 0; j <= k; j++) if (j !== i) buf[w++] = verts[base + j];
          f[base + i] = lower.insert(buf, 0);
        }
      }
    }
    faces[k] = f;
  }
  const cofacePtr: Int32Array[] = [];
  const cofaceEntry: Int32Array[] = [];
  for (let k = 0; k < top; k++) {
    const n = simplices[k].size;
    const f = faces[k + 1];
    const ptr = new Int32Array(n + 1);
    for (let e = 0; e < f.length; e++) ptr[f[e] + 1]++;
    for (let s = 0; s < n; s++) ptr[s + 1] += ptr[s];
    const fill = ptr.slice(0, n);
    const entry = new Int32Array(f.length);
    for (let e = 0; e < f.length; e++) entry[fill[f[e]]++] = e;
    cofacePtr.push(ptr);
    cofaceEntry.push(entry);
  }
  return { dimension: top, vertexIds, simplices, faces, cofacePtr, cofaceEntry };
}

/** Original vertex ids of k-simplex s, increasing. */
export function simplexIds(complex: SimplicialComplex, k: number, s: number): number[] {
  const t = complex.simplices[k];
  const ids: number[] = [];
  for (let i = 0; i <= k; i++) ids.push(complex.vertexIds[t.vertex(s, i)]);
  return ids;
}
