/**
 * Distinct sorted triangles from a flat list (3 vertices each, each triple
 * increasing), without hashing: a counting sort by lowest vertex, then the
 * few triangles sharing a lowest vertex are sorted and compared in place.
 * Returns the distinct triples back to back and their count.
 */
export function uniqueTriangles(list: Int32Array, nVertices: number): { verts: Int32Array; count: number } {
  const n = list.length / 3;
  const start = new Int32Array(nVertices + 1);
  for (let t = 0; t < n; t++) start[list[3 * t] + 1]++;
  for (let v = 0; v < nVertices; v++) start[v + 1] += start[v];
  const fill = start.slice(0, nVertices);
  const b = new Int32Array(n);
  const c = new Int32Array(n);
  for (let t = 0; t < n; t++) {
    const p = fill[list[3 * t]]++;
    b[p] = list[3 * t + 1];
    c[p] = list[3 * t + 2];
  }
  const verts = new Int32Array(3 * n);
  let count = 0;
  for (let a = 0; a < nVertices; a++) {
    const lo = start[a];
    const hi = start[a + 1];
    // Insertion sort by (b, c): buckets hold a handful of triangles.
    for (let i = lo + 1; i < hi; i++) {
      const bi = b[i];
      const ci = c[i];
      let j = i - 1;
      while (j >= lo && (b[j] > bi || (b[j] === bi && c[j] > ci))) {
        b[j + 1] = b[j];
        c[j + 1] = c[j];
        j--;
      }
      b[j + 1] = bi;
      c[j + 1] = ci;
    }
    for (let i = lo; i < hi; i++) {
      if (i > lo && b[i] === b[i - 1] && c[i] === c[i - 1]) continue;
      verts[3 * count] = a;
      verts[3 * count + 1] = b[i];
      verts[3 * count + 2] = c[i];
      count++;
    }
  }
  return { verts, count };
}
