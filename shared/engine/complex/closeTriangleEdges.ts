import { SimplexTable } from './SimplexTable';

/**
 * The edges of a set of triangles (plus any edges listed on their own),
 * without hashing: every edge is filed under its lower vertex by a counting
 * sort, and duplicates within a vertex's bucket are found with a stamp per
 * upper vertex. Two sequential passes over the incidences instead of a
 * million hash probes; edges come out ordered by lower vertex.
 *
 * Returns the edge table and, for triangle t = (a < b < c), the edges
 * opposite a, b and c at faces[3t], faces[3t+1], faces[3t+2].
 */
export function closeTriangleEdges(tri: Int32Array, nTriangles: number, listed: SimplexTable, nVertices: number): { edges: SimplexTable; faces: Int32Array } {
  const nListed = listed.size;
  const total = 3 * nTriangles + nListed;
  const start = new Int32Array(nVertices + 1);
  for (let t = 0; t < nTriangles; t++) {
    const a = tri[3 * t];
    const b = tri[3 * t + 1];
    start[a + 1] += 2; // (a,c) and (a,b)
    start[b + 1] += 1; // (b,c)
  }
  const lv = listed.vertices;
  for (let e = 0; e < nListed; e++) start[lv[2 * e] + 1]++;
  for (let v = 0; v < nVertices; v++) start[v + 1] += start[v];
  const fill = start.slice(0, nVertices);
  const upper = new Int32Array(total);
  // Which incidence each filed edge came from: 3t+i for a triangle face, −1 for a listed edge.
  const from = new Int32Array(total);
  for (let t = 0; t < nTriangles; t++) {
    const a = tri[3 * t];
    const b = tri[3 * t + 1];
    const c = tri[3 * t + 2];
    let p = fill[b]++;
    upper[p] = c;
    from[p] = 3 * t;
    p = fill[a]++;
    upper[p] = c;
    from[p] = 3 * t + 1;
    p = fill[a]++;
    upper[p] = b;
    from[p] = 3 * t + 2;
  }
  for (let e = 0; e < nListed; e++) {
    const p = fill[lv[2 * e]]++;
    upper[p] = lv[2 * e + 1];
    from[p] = -1;
  }
  // Within each lower vertex's bucket, every filed edge points at the first
  // position holding the same upper vertex: its canonical copy.
  const canon = new Int32Array(total);
  const lowerAt = new Int32Array(total);
  const stamp = new Int32Array(nVertices).fill(-1);
  const firstAt = new Int32Array(nVertices);
  for (let lo = 0; lo < nVertices; lo++) {
    for (let p = start[lo]; p < start[lo + 1]; p++) {
      const hi = upper[p];
      if (stamp[hi] !== lo) {
        stamp[hi] = lo;
        firstAt[hi] = p;
      }
      canon[p] = firstAt[hi];
      lowerAt[p] = lo;
    }
  }
  // Number edges in the order the triangles meet them, not bucket order: a
  // triangle's three edges then sit close together in every later array,
  // which the reduction's sweeps over triangles read in turn.
  const posOf = new Int32Array(3 * nTriangles);
  for (let p = 0; p < total; p++) if (from[p] >= 0) posOf[from[p]] = p;
  const idAt = new Int32Array(total).fill(-1);
  const verts = new Int32Array(2 * total);
  const faces = new Int32Array(3 * nTriangles);
  let count = 0;
  const idFor = (p: number) => {
    const c = canon[p];
    let id = idAt[c];
    if (id < 0) {
      id = count++;
      idAt[c] = id;
      verts[2 * id] = lowerAt[c];
      verts[2 * id + 1] = upper[c];
    }
    return id;
  };
  for (let e = 0; e < 3 * nTriangles; e++) faces[e] = idFor(posOf[e]);
  for (let p = 0; p < total; p++) if (from[p] < 0) idFor(p);
  return { edges: SimplexTable.ofUnique(2, verts, count), faces };
}
