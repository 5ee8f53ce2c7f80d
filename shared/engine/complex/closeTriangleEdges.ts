import { SimplexTable } from './SimplexTable';

/**
 * The edges of a set of triangles (plus any edges listed on their own),
 * without hashing: every edge is filed under its lower vertex by a counting
 * sort, and duplicates within a vertex's bucket are found with a stamp per
 * upper vertex. Sequential passes over the incidences instead of a million
 * hash probes.
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
  for (let t = 0; t < nTriangles; t++) {
    const a = tri[3 * t];
    const b = tri[3 * t + 1];
    const c = tri[3 * t + 2];
    upper[fill[b]++] = c;
    upper[fill[a]++] = c;
    upper[fill[a]++] = b;
  }
  for (let e = 0; e < nListed; e++) upper[fill[lv[2 * e]]++] = lv[2 * e + 1];
  // Within each lower vertex's bucket, give every distinct upper vertex a
  // provisional edge id (bucket order), written over the filed upper vertex.
  const pv = new Int32Array(2 * total);
  const stamp = new Int32Array(nVertices).fill(-1);
  const idOfUpper = new Int32Array(nVertices);
  let distinct = 0;
  for (let lo = 0; lo < nVertices; lo++) {
    for (let p = start[lo]; p < start[lo + 1]; p++) {
      const hi = upper[p];
      if (stamp[hi] !== lo) {
        stamp[hi] = lo;
        idOfUpper[hi] = distinct;
        pv[2 * distinct] = lo;
        pv[2 * distinct + 1] = hi;
        distinct++;
      }
      upper[p] = idOfUpper[hi];
    }
  }
  // Replay the filing to read each incidence's provisional id, and number
  // edges in the order the triangles meet them, not bucket order: a
  // triangle's three edges then sit close together in every later array,
  // which the reduction's sweeps over triangles read in turn.
  fill.set(start.subarray(0, nVertices));
  const finalId = new Int32Array(distinct).fill(-1);
  const verts = new Int32Array(2 * distinct);
  const faces = new Int32Array(3 * nTriangles);
  let count = 0;
  const idFor = (q: number) => {
    let id = finalId[q];
    if (id < 0) {
      id = count++;
      finalId[q] = id;
      verts[2 * id] = pv[2 * q];
      verts[2 * id + 1] = pv[2 * q + 1];
    }
    return id;
  };
  for (let t = 0; t < nTriangles; t++) {
    const a = tri[3 * t];
    const b = tri[3 * t + 1];
    faces[3 * t] = idFor(upper[fill[b]++]);
    faces[3 * t + 1] = idFor(upper[fill[a]++]);
    faces[3 * t + 2] = idFor(upper[fill[a]++]);
  }
  for (let e = 0; e < nListed; e++) idFor(upper[fill[lv[2 * e]]++]);
  return { edges: SimplexTable.ofUnique(2, verts, count), faces };
}
