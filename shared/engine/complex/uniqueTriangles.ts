/**
 * Distinct sorted triangles from a flat list (3 vertices each, each triple
 * increasing), in the order the list first names them, without hashing: a
 * counting sort by lowest vertex, then the few triangles sharing a lowest
 * vertex are sorted and compared. Keeping the file's order keeps the cell
 * numbering the user's own (the ledger lists cells as the file does).
 */
export function uniqueTriangles(list: Int32Array, nVertices: number): { verts: Int32Array; count: number } {
  const n = list.length / 3;
  const start = new Int32Array(nVertices + 1);
  for (let t = 0; t < n; t++) start[list[3 * t] + 1]++;
  for (let v = 0; v < nVertices; v++) start[v + 1] += start[v];
  const fill = start.slice(0, nVertices);
  const order = new Int32Array(n);
  for (let t = 0; t < n; t++) order[fill[list[3 * t]]++] = t;
  const keep = new Uint8Array(n).fill(1);
  const later = (s: number, t: number) => {
    const bs = list[3 * s + 1];
    const bt = list[3 * t + 1];
    if (bs !== bt) return bs > bt;
    const cs = list[3 * s + 2];
    const ct = list[3 * t + 2];
    return cs !== ct ? cs > ct : s > t;
  };
  for (let a = 0; a < nVertices; a++) {
    const lo = start[a];
    const hi = start[a + 1];
    if (hi - lo < 2) continue;
    // Insertion sort by (b, c, position): buckets hold a handful of triangles.
    for (let i = lo + 1; i < hi; i++) {
      const t = order[i];
      let j = i - 1;
      while (j >= lo && later(order[j], t)) {
        order[j + 1] = order[j];
        j--;
      }
      order[j + 1] = t;
    }
    for (let i = lo + 1; i < hi; i++) {
      const s = order[i - 1];
      const t = order[i];
      if (list[3 * s + 1] === list[3 * t + 1] && list[3 * s + 2] === list[3 * t + 2]) keep[t] = 0;
    }
  }
  const verts = new Int32Array(3 * n);
  let count = 0;
  for (let t = 0; t < n; t++) {
    if (!keep[t]) continue;
    verts[3 * count] = list[3 * t];
    verts[3 * count + 1] = list[3 * t + 1];
    verts[3 * count + 2] = list[3 * t + 2];
    count++;
  }
  return { verts, count };
}
